export * from './school';
export * from './user';
export * from './session';
export * from './sign-in-throttle';
export * from './item';
export * from './learning';
