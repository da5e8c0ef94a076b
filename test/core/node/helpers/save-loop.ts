/**
 * Child process of the kill-during-save test: writes session versions
 * first, first+1, ... to argv[2] forever (until killed), printing "ready"
 * after the first. Each version is a full session file (serialised once,
 * version number substituted into savedWith) written by atomicWriteFile with a backup, the
 * write path of saveSessionFile, so nearly all the loop's time is spent
 * inside the write and a kill usually lands mid-write.
 * Run: node --import tsx test/core/node/helpers/save-loop.ts <file> <units> <firstVersion>
 */
import { serializeSessionFile } from '../../../../core/curation/serialize-session-file';
import { atomicWriteFile } from '../../../../core/node/atomic-write-file';
import { makeSession } from './make-session';

const [path, nUnits, first] = process.argv.slice(2);
// notes name no version here (so substituting the version costs nothing); savedWith does
const template = serializeSessionFile(makeSession(0, Number(nUnits))).replaceAll('version 0 of', 'note of').split('version 0');
let v = Number(first);
atomicWriteFile(path, template.join(`version ${v++}`), { backup: true });
process.stdout.write('ready\n');
for (;;) atomicWriteFile(path, template.join(`version ${v++}`), { backup: true });
