// Public surface of shared/src/analytics; filled in as its modules land.
export {};
