// piscina loads this plain file in each worker thread; it registers tsx and loads the TypeScript task.
require('tsx/cjs');
const task = require('./parse-task.ts');
module.exports = task.default ?? task;
