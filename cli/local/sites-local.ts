import type { Site } from '../../server/records/records.ts';
import { withLocalRecords } from '../records/local-records.ts';

/** Every site in this machine's records, first made first. */
export function listSitesHere(): Promise<Site[]> {
  return withLocalRecords('users', (records) => records.listSites());
}

/** Adds a site of the group to this machine's records. */
export function addSiteHere(key: string, name: string): Promise<Site> {
  return withLocalRecords('users', (records) =>
    records.addSite(key, name, { actorName: 'larder sites add (command line)' }),
  );
}
