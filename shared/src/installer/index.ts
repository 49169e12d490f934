// Public surface of shared/src/installer; filled in as its modules land.
export {};
