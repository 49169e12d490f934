// Entry of the health-report worker thread. The thread starts without the parent's TypeScript loader
// (jest, or a parent started some other way), so it registers tsx itself before loading the renderer.
require('tsx/cjs/api').register();
require('./health-report-render-thread.ts');
