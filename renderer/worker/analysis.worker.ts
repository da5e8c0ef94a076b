/**
 * The analysis Web Worker: exposes a WorkbenchEngine through comlink. All
 * computing of the workbench happens here, off the page's thread.
 */
import { expose } from 'comlink';
import { WorkbenchEngine } from './workbench-engine';

expose(new WorkbenchEngine());
