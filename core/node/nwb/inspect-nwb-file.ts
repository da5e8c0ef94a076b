/**
 * The `inspect` listing of an NWB file on disk (text, see formatNwbListing),
 * with the roles a run would use given the optional `nwb` manifest section.
 * An ambiguous choice (e.g. two OptogeneticSeries) does not stop the
 * listing: it is printed in place of the plan, so the user sees what to pick.
 */
import { basename } from 'node:path';
import { isInputError } from '../../errors';
import { formatNwbListing } from '../../io/nwb/format-nwb-listing';
import { listNwbContents } from '../../io/nwb/list-nwb-contents';
import { parseNwbManifest } from '../../io/nwb/parse-nwb-manifest';
import { planNwbRoles, type NwbPlan } from '../../io/nwb/plan-nwb-roles';
import { openHdf5File } from './open-hdf5-file';

export async function inspectNwbFile(path: string, section?: unknown, manifestFile = 'session.json'): Promise<string> {
  const file = basename(path);
  const manifest = parseNwbManifest(section, manifestFile);
  const h5 = await openHdf5File(path);
  try {
    const contents = listNwbContents(h5, file);
    let plan: NwbPlan | null = null;
    let planError: string | undefined;
    try {
      plan = planNwbRoles(contents, manifest, manifestFile);
    } catch (e) {
      if (!isInputError(e)) throw e;
      planError = e.message;
    }
    return formatNwbListing(contents, plan, planError);
  } finally {
    h5.close();
  }
}
