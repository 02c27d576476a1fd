import { FLUID_GROUPS } from './catalogue-fluids.js';
import type { NamedGroup } from './catalogue-terms.js';
import { TRANSPORT_GROUPS } from './catalogue-transport.js';

/**
 * The catalogue of named dimensionless groups, described by the kinds of quantity they combine.
 * A group found by the engine is recognised when its exponents are a power of a catalogue entry's
 * (Fr^2 is still a Froude number) with the variables' kinds fitting the entry's terms; the numeric
 * factor between the two (pi/4 for a Reynolds number written with a volume flow) is reported.
 * Entries are tried in order: write the more specific forms first. See DEVELOPERS.md, "How to add
 * a named group".
 */

/** Every named group, in the order they are tried. */
export const CATALOGUE: readonly NamedGroup[] = [...FLUID_GROUPS, ...TRANSPORT_GROUPS];

export type { CatalogueTerm, NamedGroup } from './catalogue-terms.js';
