import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireGroupRole } from '../auth/authenticate.ts';
import { personOf } from '../auth/request-person.ts';
import { conflict } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import { SITE_KEY_PATTERN, type SiteInfo, type SiteList } from '../../shared/api/site.ts';
import { noSuchSite } from './resolve-site.ts';
import type { SiteRepository } from './site-repository.ts';

const NAME = { type: 'string', minLength: 1, maxLength: 80, pattern: '\\S' } as const;

const ADD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['key', 'name'],
  properties: { key: { type: 'string', pattern: SITE_KEY_PATTERN }, name: NAME },
} as const;

const CHANGE_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['name'],
  properties: { name: NAME },
} as const;

/**
 * /api/sites: the sites the signed-in person can see, with their role at each (any person, before
 * a site is chosen, so that one can be); group-wide admins add and rename sites. A site the
 * person has no role at is answered as one that does not exist.
 */
export function sitesRouter(context: AppContext, sites: SiteRepository): Router {
  const { db, audit } = context;
  const router = Router();

  router.get('/', async (req, res) => {
    const visible: SiteInfo[] = [];
    for (const site of await sites.forPerson(personOf(req)))
      if (site.role) visible.push({ key: site.key, name: site.name, role: site.role });
    res.json({ sites: visible } satisfies SiteList);
  });

  router.post('/', requireGroupRole('admin'), validateBody(ADD_BODY), async (req, res) => {
    const { key, name } = req.body as { key: string; name: string };
    const site = await db.write(async (transaction) => {
      if (await sites.byKey(key, transaction))
        throw conflict('site-exists', `there is a site "${key}" already`);
      const added = await sites.add(key, name.trim(), transaction);
      await audit.append(
        { actor: personOf(req), action: 'site-add', subject: key, detail: { name }, ip: req.ip },
        transaction,
      );
      return added;
    });
    // A group-wide admin is admin at every site, the new one too.
    res
      .status(201)
      .location(`/api/sites/${site.key}`)
      .json({ site: { key, name, role: 'admin' } });
  });

  router.patch('/:key', requireGroupRole('admin'), validateBody(CHANGE_BODY), async (req, res) => {
    const key = String(req.params.key);
    const { name } = req.body as { name: string };
    await db.write(async (transaction) => {
      const site = await sites.byKey(key, transaction);
      if (!site) throw noSuchSite(key);
      await sites.rename(site.id, name.trim(), transaction);
      await audit.append(
        {
          actor: personOf(req),
          action: 'site-change',
          subject: key,
          detail: { name: { from: site.name, to: name.trim() } },
          ip: req.ip,
        },
        transaction,
      );
    });
    res.json({ site: { key, name: name.trim(), role: 'admin' } });
  });

  return router;
}
