export * from './tokens';
export * from './theme';
export * from './breakpoints';
