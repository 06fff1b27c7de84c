import type { UserModel } from '../db/models';

declare global {
  namespace Express {
    interface Request {
      /** Set by `authenticate` when the request carries a valid session cookie or API token. */
      auth?: { user: UserModel; via: 'cookie' | 'token'; sessionId?: string };
    }
  }
}
export {};
