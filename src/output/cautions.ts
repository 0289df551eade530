/** Cautions printed under human-readable results and carried in JSON output. */

export const GEOMETRY_CAUTION =
  'Caution: these are geometric properties of the part as described in the input. A design, a structural check or a lift ' +
  'must still be checked by a competent person against the governing code and the real part; local codes and licensed practice prevail.';

export const MASS_CAUTION =
  'Caution: masses and centres of gravity come from the geometry and the stated densities and thicknesses. Add allowances for ' +
  'welds, coatings, mill tolerances and attachments, and have every lift planned by a competent person under local regulations.';

/** Printed with every net section (member, and report when a net line is drawn). */
export const NET_SECTION_NOTE =
  'Net sections are geometry only: which line governs (a staggered chain by the s²/4g rule or another), hole allowances, ' +
  'shear lag and the resistance stay with the user and the governing code.';
