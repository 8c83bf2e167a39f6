/** HTTP helpers of the storage routes (schemas, answers, readings). */
export * from './request-schemas';
export * from './answers';
