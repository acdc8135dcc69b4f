// Demo data of our own scenario: the band Copper Fen, two of its members and a handful of their presets.
// Idempotent: fixed ids, and rows that exist already are left as they are (a user's later edits are never undone).
import { eq } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Database } from '../../server/db/client';
import { bands, memberships, presetRevisions, presets, users } from '../../server/db/schema';
import { repoRoot } from './postgres';

interface Identity {
  id: number;
  login: string;
  name: string;
  email: string;
}

export const demoIdentities: Identity[] = JSON.parse(
  readFileSync(join(repoRoot, 'fakes/github/identities.json'), 'utf8'),
);

const ids = {
  mira: '7a6e0000-0000-4000-8000-000000000001',
  tobias: '7a6e0000-0000-4000-8000-000000000002',
  band: '7a6e0000-0000-4000-8000-00000000b001',
  preset: (n: number) => `7a6e0000-0000-4000-8000-0000000c00${String(n).padStart(2, '0')}`,
};

export const demoBand = { id: ids.band, name: 'Copper Fen' };
export const demoMembers = [
  { id: ids.mira, login: 'mira-vale', role: 'owner' as const },
  { id: ids.tobias, login: 'tobias-reed', role: 'editor' as const },
];

const whiteKeys = [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6];

interface DemoPreset {
  n: number;
  owner: string;
  band: boolean;
  revisions: { note: string; document: Record<string, unknown> }[];
}

const presetDocument = (name: string, scale: object, mapping: object, notes?: string) => ({
  format: 'keyloom.preset',
  version: 1,
  name,
  ...(notes ? { notes } : {}),
  scale,
  mapping,
});

export const demoPresets: DemoPreset[] = [
  {
    n: 1,
    owner: ids.mira,
    band: true,
    revisions: [
      {
        note: 'Seven pure fifths on the white keys',
        document: presetDocument(
          'Fen Fifths',
          { kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 },
          { rootKey: 60, concertA: 440, keysPerPeriod: 12, layout: whiteKeys },
          'Stacked pure fifths from C for the drone pieces.',
        ),
      },
      {
        note: 'Twelve tones, wolf between G sharp and E flat',
        document: presetDocument(
          'Fen Fifths',
          { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
          { rootKey: 60, concertA: 440 },
          'Stacked pure fifths from C for the drone pieces.',
        ),
      },
    ],
  },
  {
    n: 2,
    owner: ids.mira,
    band: true,
    revisions: [
      {
        note: 'Quarter-comma fifths for the reed organ set',
        document: presetDocument(
          'Reed Organ Meantone',
          {
            kind: 'generated',
            generator: '3/2',
            period: '2/1',
            up: 8,
            down: 3,
            temper: { comma: '81/80', fraction: '1/4' },
          },
          { rootKey: 60, concertA: 440 },
        ),
      },
    ],
  },
  {
    n: 3,
    owner: ids.tobias,
    band: true,
    revisions: [
      {
        note: 'Thirty-one equal steps, one per key',
        document: presetDocument(
          'Thirty-One Lanes',
          { kind: 'equal', divisions: 31, period: '2/1' },
          { rootKey: 48, concertA: 440 },
        ),
      },
    ],
  },
  {
    n: 4,
    owner: ids.tobias,
    band: true,
    revisions: [
      {
        note: 'Just major for the vocal harmonies',
        document: presetDocument(
          'Marsh Choir Just',
          { kind: 'list', degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'], period: '2/1' },
          { rootKey: 62, concertA: 440, keysPerPeriod: 12, layout: whiteKeys },
        ),
      },
    ],
  },
  {
    n: 5,
    owner: ids.mira,
    band: false,
    revisions: [
      {
        note: 'Harmonics eight to sixteen over low C',
        document: presetDocument(
          'Lantern Harmonics',
          { kind: 'harmonic', from: 8, to: 16 },
          { rootKey: 36, concertA: 440 },
        ),
      },
    ],
  },
];

export async function seedDemoData(db: Database): Promise<void> {
  const identity = (login: string) => {
    const found = demoIdentities.find((i) => i.login === login);
    if (!found) throw new Error(`fakes/github/identities.json has no demo identity ${login}`);
    return found;
  };
  await db.transaction(async (tx) => {
    // A demo member who signed in before the seed ran already has a row: keep it and use its id.
    const userIds = new Map<string, string>();
    for (const member of demoMembers) {
      const { id, name, email } = identity(member.login);
      await tx
        .insert(users)
        .values({ id: member.id, githubId: String(id), login: member.login, name, email })
        .onConflictDoNothing();
      const [row] = await tx
        .select({ id: users.id })
        .from(users)
        .where(eq(users.githubId, String(id)));
      userIds.set(member.id, row.id);
    }
    const userId = (fixedId: string) => userIds.get(fixedId)!;
    await tx
      .insert(bands)
      .values({ ...demoBand, createdBy: userId(ids.mira) })
      .onConflictDoNothing();
    for (const member of demoMembers) {
      await tx
        .insert(memberships)
        .values({ bandId: ids.band, userId: userId(member.id), role: member.role })
        .onConflictDoNothing();
    }
    for (const preset of demoPresets) {
      const latest = preset.revisions.at(-1)!;
      const inserted = await tx
        .insert(presets)
        .values({
          id: ids.preset(preset.n),
          ownerId: userId(preset.owner),
          bandId: preset.band ? ids.band : null,
          name: String(latest.document['name']),
          latestRevision: preset.revisions.length,
        })
        .onConflictDoNothing()
        .returning({ id: presets.id });
      if (inserted.length === 0) continue;
      await tx.insert(presetRevisions).values(
        preset.revisions.map((revision, index) => ({
          presetId: ids.preset(preset.n),
          revision: index + 1,
          document: revision.document,
          note: revision.note,
          authorId: userId(preset.owner),
        })),
      );
    }
  });
}
