export { Organization } from './organization';
export { User, ROLES, type Role } from './user';
export { Session } from './session';
export { AuthToken, AUTH_TOKEN_PURPOSES, type AuthTokenPurpose } from './auth-token';

import { AuthToken } from './auth-token';
import { Organization } from './organization';
import { Session } from './session';
import { User } from './user';

/** Every entity, for the ORM config. Add new entities here. */
export const entities = [Organization, User, Session, AuthToken];
