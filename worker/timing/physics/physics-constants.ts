/**
 * Constants used only by the derived-quantity routines in this folder.
 * The solar mass in time units, c, the au and the Sun/Jupiter ratio live in
 * ../delays/physical-constants.ts and are re-used from there.
 */

/** Sun/Earth mass ratio GM☉/GM⊕ of the DE405 ephemeris, 332 946.050895 (Standish 1998, JPL IOM 312.F-98-048). */
export const SUN_TO_EARTH_MASS_RATIO = 332_946.050895;

/** Neutron-star moment of inertia assumed for spin-down luminosity, g cm² (common practice; Lorimer & Kramer 2005, §3.1). */
export const NEUTRON_STAR_MOMENT_OF_INERTIA_G_CM2 = 1e45;

/** Pulsar mass assumed for minimum companion masses, solar masses (common practice, the canonical neutron-star mass). */
export const DEFAULT_PULSAR_MASS_SOLAR = 1.4;

/** Surface dipole field coefficient: B = 3.2 × 10¹⁹ G √(P Ṗ), P in s (Lorimer & Kramer 2005, eq. 3.15). */
export const SURFACE_FIELD_COEFFICIENT_GAUSS = 3.2e19;
