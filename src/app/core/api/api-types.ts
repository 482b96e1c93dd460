/** The API's people, session and error shapes, declared once in shared/api/ (types only). */
export type { ApiErrorBody } from '../../../../shared/api/api-error.ts';
export type {
  DemoInfo,
  DemoSignIn,
  Person,
  Role,
  SessionInfo,
  SessionState,
} from '../../../../shared/api/person.ts';
export type { SiteInfo, SiteList, SiteRole } from '../../../../shared/api/site.ts';
