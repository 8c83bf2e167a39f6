export * from './unit-definitions';
export * from './convert-unit';
export * from './display-units';
export * from './format-quantity';
export * from './parse-quantity';
export * from './coordinate-unit';
