// Who may do what in a band and with a preset: the names both sides use, declared once.

/** A member's role in a band, highest first. */
export const bandRoles = ['owner', 'editor', 'viewer'] as const;
export type BandRole = (typeof bandRoles)[number];

/** What the caller may do with a preset, in rising order: see it, change it, manage it (trash, share, band). */
export const presetAccessLevels = ['read', 'edit', 'own'] as const;
export type PresetAccess = (typeof presetAccessLevels)[number];
