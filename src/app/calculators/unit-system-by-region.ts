/* Which unit system a first visit opens in, from the region of the browser's languages. */

import type { UnitSystem } from './unit-system';

/**
 * Regions whose everyday and trade units are US customary: the United States and the territories
 * under its federal weights and measures (Puerto Rico, Guam, the US Virgin Islands, American Samoa,
 * the Northern Mariana Islands, the Minor Outlying Islands; Puerto Rico mixes in some metric, such
 * as kilometres on road signs). Liberia and Myanmar are the two other countries usually listed as
 * never having made the metric system official; both use metric widely in practice and have
 * announced moves to it, so for them this is a first guess only (from memory, not a cited source).
 */
const usCustomaryRegions: ReadonlySet<string> = new Set(['US', 'PR', 'GU', 'VI', 'AS', 'MP', 'UM', 'LR', 'MM']);

/**
 * US customary when the reader's most preferred language names a US-customary region (`en-US`,
 * `es-PR`), SI otherwise (`en-GB`, `de-DE`, `fr-CA`, `en-CA`, `en-AU`). A tag without a region
 * (`en`) takes the region of a later tag of the same language (`en`, `en-US`); failing that, SI.
 *
 * No `Intl.Locale.maximize()`: it would fill in the likeliest region by speaker population, so a bare
 * `en` would become `en-US` (and Burmese `my` `my-MM`), although English readers without a region
 * are spread over the whole world, most of them working in SI. A wrong SI guess costs one click.
 */
export function unitSystemForLanguages(languages: readonly string[]): UnitSystem {
  const tags = languages.map(parseTag).filter((tag) => tag !== undefined);
  const first = tags[0];
  if (first === undefined) return 'si';
  const region = first.region ?? tags.find((tag) => tag.language === first.language && tag.region !== undefined)?.region;
  return region !== undefined && usCustomaryRegions.has(region) ? 'us' : 'si';
}

/** The browser's languages, most preferred first (empty when there is no browser). */
export function browserLanguages(): readonly string[] {
  const nav = globalThis.navigator;
  if (nav === undefined) return [];
  if (nav.languages?.length) return nav.languages;
  return nav.language ? [nav.language] : [];
}

function parseTag(tag: string): Intl.Locale | undefined {
  try {
    return new Intl.Locale(tag);
  } catch {
    // Not a well-formed BCP 47 tag: skip it.
    return undefined;
  }
}
