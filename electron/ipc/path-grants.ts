import { randomUUID } from 'node:crypto';
import { realpath, stat } from 'node:fs/promises';
import { basename, dirname, isAbsolute, join, relative, sep } from 'node:path';
import { HandlerError } from './handler-error';

/** What the user picked: a session folder or one NWB file. */
export interface Grant {
  readonly id: string;
  readonly kind: 'folder' | 'nwb';
  /** Real (symlink-free) absolute path of the picked folder or file. */
  readonly root: string;
}

/**
 * Access grants for what the user picked in a native dialog (or reopened from
 * the recent list). The renderer names files only by grant id and a relative
 * name; resolve() returns an absolute path only when the file's real path
 * (symlinks followed) lies inside the picked folder, or is the picked NWB file
 * itself. Absolute names, "..", NUL bytes, backslashes and symlink escapes are
 * refused. Grants live as long as the main process.
 */
export class PathGrants {
  private readonly grants = new Map<string, Grant>();

  /** Grants access to a picked path; returns the grant. */
  async grant(pickedPath: string, kind: 'folder' | 'nwb'): Promise<Grant> {
    if (!isAbsolute(pickedPath)) throw new HandlerError(`The picked path "${pickedPath}" is not absolute.`);
    let root: string;
    try {
      root = await realpath(pickedPath);
    } catch {
      throw new HandlerError(`"${pickedPath}" does not exist or cannot be read.`);
    }
    const st = await stat(root);
    if (kind === 'folder' && !st.isDirectory()) throw new HandlerError(`"${pickedPath}" is not a folder.`);
    if (kind === 'nwb' && !st.isFile()) throw new HandlerError(`"${pickedPath}" is not a file.`);
    const g: Grant = { id: randomUUID(), kind, root };
    this.grants.set(g.id, g);
    return g;
  }

  /** The grant with this id, or a HandlerError. */
  get(grantId: string): Grant {
    const g = this.grants.get(grantId);
    if (!g) throw new HandlerError('That session is no longer open; open it again.');
    return g;
  }

  /**
   * Absolute real path of `name` inside the grant. For a folder grant, name is
   * relative ("spikes.csv", "raw/probe.bin"); for an NWB grant it must be the
   * file's base name.
   */
  async resolve(grantId: string, name: string): Promise<string> {
    const g = this.get(grantId);
    checkRelativeName(name);
    if (g.kind === 'nwb') {
      if (name !== basename(g.root)) throw new HandlerError(`"${name}" is not the NWB file you opened.`);
      return g.root;
    }
    const candidate = join(g.root, ...name.split('/'));
    let real: string;
    try {
      real = await realpath(candidate);
    } catch {
      throw new HandlerError(`"${name}" was not found in the session folder.`);
    }
    if (!isInside(g.root, real)) throw new HandlerError(`"${name}" lies outside the session folder you picked.`);
    return real;
  }

  /** Where the workbench state of a grant is saved: inside the folder, or beside the NWB file. */
  statePath(grantId: string, fileName: string): string {
    const g = this.get(grantId);
    return g.kind === 'folder' ? join(g.root, fileName) : join(dirname(g.root), `${basename(g.root)}.${fileName}`);
  }
}

/** Refuses names that are absolute, climb out, or hold characters paths must not. */
export function checkRelativeName(name: string): void {
  if (name.length === 0 || name.length > 1024) throw new HandlerError('A file name must be 1 to 1024 characters long.');
  if (name.includes('\0') || name.includes('\\')) throw new HandlerError(`"${name.replace(/\0/g, '')}" holds a character not allowed in a file name.`);
  if (name.startsWith('/') || /^[A-Za-z]:/.test(name)) throw new HandlerError(`"${name}" is an absolute path; name files relative to the session.`);
  if (name.split('/').some((part) => part === '..' || part === '.' || part === '')) {
    throw new HandlerError(`"${name}" is not a plain relative file name.`);
  }
}

/** True when `child` equals `root` or lies below it (both real, absolute). */
export function isInside(root: string, child: string): boolean {
  const rel = relative(root, child);
  return rel === '' || (!rel.startsWith(`..${sep}`) && rel !== '..' && !isAbsolute(rel));
}
