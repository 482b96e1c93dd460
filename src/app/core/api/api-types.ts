/** The API's people, session and error shapes, declared once in shared/api/ (types only). */
export type { ApiErrorBody } from '../../../../shared/api/api-error.ts';
export type { Person, Role, SessionInfo } from '../../../../shared/api/person.ts';
