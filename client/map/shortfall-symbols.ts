/** The shortfall symbols of the designer map: the one set in `shared/exports/shortfall-symbols.ts`. */
export * from '../../shared/exports/shortfall-symbols';
