export * from './common';
export * from './auth';
export * from './users';
export * from './mail';
export * from './health';
export * from './library';
export * from './thermo';
export * from './reviews';
