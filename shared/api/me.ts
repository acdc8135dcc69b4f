// `GET /api/me`: who is signed in.

export const siteRoles = ['member', 'admin'] as const;
export type SiteRole = (typeof siteRoles)[number];

export interface Member {
  id: string;
  login: string;
  name: string | null;
  email: string | null;
  avatarUrl: string | null;
  siteRole: SiteRole;
}

export interface MeAnswer {
  user: Member | null;
}
