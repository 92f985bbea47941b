export * from './ampacity';
