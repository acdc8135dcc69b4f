import { DestroyRef, Injectable, Injector, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { ActivatedRoute, Router } from '@angular/router';
import { debounceTime, distinctUntilChanged } from 'rxjs';
import { DesignState } from './design-state';
import { type DraftDocument, type ScaleKind, draftFrom } from './draft-document';

/** The first characters of every address this Keyloom writes: the encoding's own version. */
const encodingPrefix = '1.';

/**
 * Short names for the preset document's fields, so that a design fits a link. Every name is one
 * letter and no field of the document is one letter long, so the two never meet.
 */
const shortNames: Record<string, string> = {
  name: 'n',
  notes: 'o',
  scale: 's',
  kind: 'k',
  generator: 'g',
  period: 'p',
  up: 'u',
  down: 'd',
  temper: 't',
  comma: 'c',
  fraction: 'f',
  divisions: 'e',
  degrees: 'r',
  from: 'a',
  to: 'b',
  sub: 'h',
  mapping: 'm',
  rootKey: 'K',
  rootHz: 'H',
  concertA: 'A',
  keysPerPeriod: 'P',
  layout: 'L',
  output: 'O',
  deviceId: 'D',
  program: 'G',
  bank: 'B',
  tuningName: 'N',
  bendRange: 'R',
  memberChannels: 'C',
  anchor: 'Y',
  key: 'y',
  hz: 'z',
};
const scaleKinds: ScaleKind[] = ['generated', 'equal', 'list', 'harmonic'];
const longNames = Object.fromEntries(
  Object.entries(shortNames).map(([long, short]) => [short, long]),
);

function renameKeys(value: unknown, names: Record<string, string>): unknown {
  if (Array.isArray(value)) return value.map((item) => renameKeys(item, names));
  if (value === null || typeof value !== 'object') return value;
  return Object.fromEntries(
    Object.entries(value).map(([key, inner]) => [names[key] ?? key, renameKeys(inner, names)]),
  );
}

function toBase64Url(bytes: Uint8Array): string {
  let binary = '';
  for (const byte of bytes) binary += String.fromCharCode(byte);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): Uint8Array {
  const binary = atob(text.replace(/-/g, '+').replace(/_/g, '/'));
  return Uint8Array.from(binary, (character) => character.charCodeAt(0));
}

/** A design as the `d` parameter of an address: short field names, UTF-8 JSON, base64url. */
export function encodeDesign(draft: DraftDocument): string {
  const { format: _, version: __, ...content } = draft;
  const json = JSON.stringify(renameKeys(content, shortNames));
  return encodingPrefix + toBase64Url(new TextEncoder().encode(json));
}

/** Reads the `d` parameter back into a design, or says in plain words why it cannot. */
export function decodeDesign(text: string): DraftDocument | string {
  if (!text.startsWith(encodingPrefix)) {
    return 'The design in this address was written by another version of Keyloom and cannot be read here.';
  }
  try {
    const json = new TextDecoder('utf-8', { fatal: true }).decode(
      fromBase64Url(text.slice(encodingPrefix.length)),
    );
    const content = renameKeys(JSON.parse(json), longNames);
    const design = content as Partial<DraftDocument> | null;
    if (
      !design ||
      typeof design !== 'object' ||
      !scaleKinds.includes(design.scale?.kind as ScaleKind)
    ) {
      throw new Error('not a design');
    }
    return draftFrom({ ...(design as DraftDocument), format: 'keyloom.preset', version: 1 });
  } catch {
    return 'The design in this address is damaged (perhaps cut short when it was copied) and cannot be read.';
  }
}

/** How long the address waits for typing to pause before it is rewritten. */
const addressDelayMs = 400;

/**
 * Keeps a design that is not saved as it stands in the page's address (`?d=`), so that a bookmark
 * or a reload brings it back, and a sign-in returns to it.
 */
@Injectable()
export class DesignAddress {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly state = inject(DesignState);
  private readonly injector = inject(Injector);
  private readonly destroyRef = inject(DestroyRef);
  private following = false;
  private readonly encoded = computed(() =>
    this.state.dirty() ? encodeDesign(this.state.draft()) : null,
  );

  /** Where signing in starts, coming back to this page with this design. */
  readonly signInHref = computed(() => {
    const path = this.router.url.split('?')[0];
    const encoded = this.encoded();
    const back = encoded ? `${path}?d=${encoded}` : path;
    return `/auth/github?next=${encodeURIComponent(back)}`;
  });

  /** The design the address held when the page opened, or why it cannot be read; null when it held none. */
  initial(): DraftDocument | string | null {
    const encoded = this.route.snapshot.queryParamMap.get('d');
    return encoded ? decodeDesign(encoded) : null;
  }

  /** From now on, rewrites `d` as the design changes, and drops it when the design is saved as it stands. */
  follow(): void {
    if (this.following) return;
    this.following = true;
    toObservable(this.encoded, { injector: this.injector })
      .pipe(
        debounceTime(addressDelayMs),
        distinctUntilChanged(),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((d) => {
        // A navigation under way (the musician went to another page while typing paused) must not be overtaken by
        // this rewrite, which would bring them back here; the page it leaves is being left anyway.
        if (this.router.currentNavigation()) return;
        void this.router.navigate([], {
          relativeTo: this.route,
          queryParams: { d },
          queryParamsHandling: 'merge',
          replaceUrl: true,
        });
      });
  }
}
