/** The tool's version, from tagbench's package.json (see project-root.ts). */
import { projectRoot } from './project-root';

export function toolVersion(): string {
  return projectRoot().version;
}
