/** The site view: the page a share link opens. */
export * from './site-view';
export * from './site-plan';
export * from './site-level-chart';
export * from './site-api';
export * from './nearest-well';
