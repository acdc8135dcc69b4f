import { Router } from 'express';
import type { MeAnswer } from '../../shared/api/me';

/** Who is signed in: `{ user: null }` for a visitor. */
export function meRouter(): Router {
  return Router().get('/api/me', (req, res) => {
    const user = req.user;
    res.json({
      user: user
        ? {
            id: user.id,
            login: user.login,
            name: user.name,
            email: user.email,
            avatarUrl: user.avatarUrl,
            siteRole: user.siteRole,
          }
        : null,
    } satisfies MeAnswer);
  });
}
