/**
 * The CLI's sub-commands, in the order `tagbench --help` lists them.
 * To add one: write core/node/commands/<name>.ts exporting a Command, and
 * add a line here.
 */
import { loadSession } from '../load-session';
import { curateCommand } from './curate';
import { exportCommand } from './export';
import { inspectCommand } from './inspect';
import { createPredictCommand } from './predict';
import { createPsthCommand } from './psth';
import { reportCommand } from './report';
import { runCommand } from './run';
import { batchCommand } from './batch';
import type { Command } from './types';

export const COMMANDS: readonly Command[] = [
  runCommand,
  inspectCommand,
  // alignment and indicator kernels
  createPsthCommand((path) => loadSession(path)),
  createPredictCommand((path) => loadSession(path)),
  // curation, exports and report
  curateCommand,
  exportCommand,
  reportCommand,
  // many sessions
  batchCommand,
];
