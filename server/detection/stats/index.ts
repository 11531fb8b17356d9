export * from './ewma';
export * from './cusum';
export * from './regression';
export * from './robust';
