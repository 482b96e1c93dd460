import { Router, type Request, type RequestHandler } from 'express';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import { requireGroupRole } from '../auth/authenticate.ts';
import { MIN_PASSWORD_LENGTH, randomPassword } from '../auth/passwords.ts';
import { personOf } from '../auth/request-person.ts';
import { AppError, badRequest, conflict, notFound } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import { sendInvitation, type InvitationSent } from '../invitations/send-invitation.ts';
import { ROLES, type Person, type Role } from '../../shared/api/person.ts';
import { SITE_KEY_PATTERN, type SiteRole } from '../../shared/api/site.ts';
import { noSuchSite } from '../sites/resolve-site.ts';
import { SiteRepository } from '../sites/site-repository.ts';
import { holdRoleAtOneSite } from './role-at-one-site.ts';

const USERNAME = { type: 'string', pattern: '^[a-z][a-z0-9._-]{1,31}$' } as const;
const DISPLAY_NAME = { type: 'string', minLength: 1, maxLength: 80 } as const;
const EMAIL = {
  anyOf: [
    { type: 'string', pattern: '^[^@\\s]+@[^@\\s]+\\.[^@\\s]+$', maxLength: 200 },
    { type: 'null' },
  ],
} as const;
const PASSWORD = { type: 'string', minLength: MIN_PASSWORD_LENGTH, maxLength: 256 } as const;
const ROLE = { enum: ROLES } as const;

const ADD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['username', 'displayName', 'role'],
  properties: {
    username: USERNAME,
    displayName: DISPLAY_NAME,
    email: EMAIL,
    role: ROLE,
    password: PASSWORD,
    // The role holds at this site only (a cook of one shop); without it, at every site.
    site: { type: 'string', pattern: SITE_KEY_PATTERN },
  },
} as const;

/** Roles at single sites: the whole list, replacing the one before; each site once. */
const SITE_ROLES = {
  type: 'array',
  maxItems: 200,
  items: {
    type: 'object',
    additionalProperties: false,
    required: ['key', 'role'],
    properties: { key: { type: 'string', pattern: SITE_KEY_PATTERN }, role: ROLE },
  },
} as const;

const CHANGE_BODY = {
  type: 'object',
  additionalProperties: false,
  minProperties: 1,
  properties: {
    displayName: DISPLAY_NAME,
    email: EMAIL,
    role: ROLE,
    // false: no role at every site, only the roles `sites` gives; a `role` sent makes it true.
    roleEverywhere: { type: 'boolean' },
    sites: SITE_ROLES,
    active: { type: 'boolean' },
  },
} as const;

/** What PATCH /api/people/:id may change. */
interface PersonChanges {
  displayName?: string;
  email?: string | null;
  role?: Role;
  roleEverywhere?: boolean;
  sites?: SiteRole[];
  active?: boolean;
}

const RESET_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: { password: PASSWORD },
} as const;

const OWN_PASSWORD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['current', 'password'],
  properties: { current: { type: 'string', minLength: 1, maxLength: 256 }, password: PASSWORD },
} as const;

// A resend carries nothing: no body, or an empty object.
const EMPTY_BODY = { type: 'object', additionalProperties: false } as const;
const noBody: RequestHandler = (req, _res, next) => {
  req.body ??= {};
  next();
};

function idParam(req: Request): number {
  const text = String(req.params.id);
  const id = Number(text);
  if (!/^[1-9]\d{0,15}$/.test(text) || !Number.isSafeInteger(id))
    throw badRequest('the person id must be a whole number');
  return id;
}

/**
 * /api/people: admins manage people; anyone changes their own password and may read the names
 * of the active admins (GET /api/people/admins), to know whom to ask.
 */
export function peopleRouter(context: AppContext): Router {
  const { db, people, audit, mail, records } = context;
  const sites = new SiteRepository(db);
  const router = Router();
  /** People with their roles at single sites. */
  const withSites = async (list: Person[]): Promise<Person[]> => {
    const roles = await sites.rolesOfPeople();
    return list.map((person) => ({ ...person, sites: roles.get(person.id) ?? [] }));
  };

  router.put('/me/password', validateBody(OWN_PASSWORD_BODY), async (req, res) => {
    const me = personOf(req);
    const { current, password } = req.body as { current: string; password: string };
    if (!(await people.authenticate(me.username, current)))
      throw new AppError(403, 'wrong-password', 'the current password is wrong');
    const cutoff = await db.write(async (transaction) => {
      const changedAt = await people.setPassword(me.id, password, transaction);
      await audit.append(
        {
          actor: me,
          action: 'password-reset',
          subject: me.username,
          detail: { own: true },
          ip: req.ip,
        },
        transaction,
      );
      return changedAt;
    });
    // Other sessions with the old password end; the one making the change carries on.
    if (req.authVia === 'session') req.session.signedInAt = cutoff;
    res.status(204).end();
  });

  // Whom to ask: a page for admins tells anyone else the names of the active admins, no more.
  router.get('/admins', async (_req, res) => {
    const admins = (await people.list())
      .filter((person) => person.active && person.role === 'admin' && person.roleEverywhere)
      .map((person) => ({ displayName: person.displayName }));
    res.json({ admins });
  });

  // People are the group's: its admins manage them, not an admin of one site.
  router.use(requireGroupRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ people: await withSites(await people.list()) });
  });

  router.post('/', validateBody(ADD_BODY), async (req, res) => {
    const body = req.body as {
      username: string;
      displayName: string;
      email?: string | null;
      role: Role;
      password?: string;
      site?: string;
    };
    const { site: key, ...request } = body;
    const password = body.password ?? randomPassword();
    const by = { actor: personOf(req), ip: req.ip };
    const { alongside } = await records.addPerson(
      { ...request, email: body.email ?? null, password },
      by,
      async (transaction, added) => {
        let person = added;
        if (key !== undefined) {
          const site = await sites.byKey(key, transaction);
          if (!site) throw noSuchSite(key);
          person = await holdRoleAtOneSite(context, transaction, added, site, by);
        }
        // With an address, an invitation to set their own password goes out with the add.
        const invitation: InvitationSent | null = added.email
          ? await sendInvitation(context, transaction, added, by)
          : null;
        return { person, invitation };
      },
    );
    const { person, invitation } = alongside as {
      person: Person;
      invitation: InvitationSent | null;
    };
    if (invitation) mail.delivery.kick();
    // A generated password is shown this once, for the admin to pass on.
    res.status(201).json({
      person: (await withSites([person]))[0],
      ...(body.password ? {} : { password }),
      invitation,
    });
  });

  router.post('/:id/invitation', noBody, validateBody(EMPTY_BODY), async (req, res) => {
    const id = idParam(req);
    const invitation = await db.write(async (transaction) => {
      const person = await people.findById(id, transaction);
      if (!person) throw notFound(`no person with id ${id}`);
      return sendInvitation(context, transaction, person, { actor: personOf(req), ip: req.ip });
    });
    mail.delivery.kick();
    res.status(201).json({ invitation });
  });

  router.patch('/:id', validateBody(CHANGE_BODY), async (req, res) => {
    const id = idParam(req);
    const { sites: siteRoles, ...changes } = req.body as PersonChanges;
    // A role at every site given is a role at every site held.
    if (changes.role !== undefined) changes.roleEverywhere ??= true;
    const person = await db.write(async (transaction) => {
      const before = await people.findById(id, transaction);
      if (!before) throw notFound(`no person with id ${id}`);
      const losesAdmin =
        before.role === 'admin' &&
        before.roleEverywhere !== false &&
        before.active &&
        (changes.active === false ||
          changes.roleEverywhere === false ||
          (changes.role && changes.role !== 'admin'));
      if (losesAdmin && (await people.activeAdmins(transaction)) <= 1) {
        throw conflict(
          'last-admin',
          'this is the last active admin; make someone else admin first',
        );
      }
      if (siteRoles) await setSiteRoles(sites, id, siteRoles, transaction);
      const after = await people.update(id, changes, transaction);
      await audit.append(
        {
          actor: personOf(req),
          action: 'person-change',
          subject: before.username,
          detail: siteRoles ? { ...changes, sites: siteRoles } : changes,
          ip: req.ip,
        },
        transaction,
      );
      return after;
    });
    res.json({ person: person && (await withSites([person]))[0] });
  });

  router.post('/:id/password', validateBody(RESET_BODY), async (req, res) => {
    const id = idParam(req);
    const given = (req.body as { password?: string }).password;
    const password = given ?? randomPassword();
    await records.resetPassword({ id }, password, { actor: personOf(req), ip: req.ip });
    res.json(given ? {} : { password });
  });

  return router;
}

/** Puts a person's roles at single sites to the list given; 404 for a site that does not exist. */
async function setSiteRoles(
  sites: SiteRepository,
  personId: number,
  roles: readonly SiteRole[],
  transaction: Transaction,
): Promise<void> {
  const all = await sites.list(transaction);
  const keys = new Set<string>();
  const byKey: { siteId: number; role: Role }[] = [];
  for (const { key, role } of roles) {
    const site = all.find((s) => s.key === key);
    if (!site) throw noSuchSite(key);
    if (keys.has(key)) throw badRequest(`site ${key} is given twice`);
    keys.add(key);
    byKey.push({ siteId: site.id, role });
  }
  await sites.setRoles(personId, byKey, transaction);
}
