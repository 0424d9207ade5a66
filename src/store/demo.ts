export * from './demoData';
