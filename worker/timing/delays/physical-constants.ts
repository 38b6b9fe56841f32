/**
 * Physical and astronomical constants used by the delay and orbit routines.
 * Each value names its source; lengths are in light-seconds so that a
 * position in light-seconds dotted with a unit vector is a delay in seconds.
 */

/** Astronomical unit in light-seconds: 149 597 870 700 m / 299 792 458 m/s (IAU 2012 Resolution B2). */
export const AU_LIGHT_SECONDS = 149_597_870_700 / 299_792_458;

/** Speed of light, m/s (exact by definition of the metre, CGPM 1983). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** Heliocentric gravitational constant GM☉, m³/s² (IERS Conventions 2010, Table 1.1, TDB-compatible). */
export const GM_SUN_M3_PER_S2 = 1.32712440041e20;

/** T☉ = GM☉/c³ in seconds (≈ 4.925490947 µs), the solar mass in time units. */
export const SUN_MASS_SECONDS = GM_SUN_M3_PER_S2 / SPEED_OF_LIGHT_M_PER_S ** 3;

/** Sun/Jupiter mass ratio of the DE405 ephemeris (Standish 1998, JPL IOM 312.F-98-048). */
export const SUN_TO_JUPITER_MASS_RATIO = 1047.3486;

/** GM_J/c³ in seconds, Jupiter (with its satellites) in time units. */
export const JUPITER_MASS_SECONDS = SUN_MASS_SECONDS / SUN_TO_JUPITER_MASS_RATIO;

/**
 * Dispersion constant: delay = DM_DELAY_CONSTANT_S · DM / f², DM in pc cm⁻³ and f in MHz
 * (Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, eq. 4.7: 4.148808 × 10³ s).
 * The rounded form DM / (2.41 × 10⁻⁴ · f²) differs from it by 1.4 × 10⁻⁴ relative.
 */
export const DM_DELAY_CONSTANT_S_MHZ2 = 4.148808e3;

/** Milliarcseconds to radians. */
export const RAD_PER_MAS = Math.PI / (180 * 3600 * 1000);

/** Days in a Julian year (IAU), the year of proper motions and DM derivatives. */
export const DAYS_PER_JULIAN_YEAR = 365.25;

export const SECONDS_PER_JULIAN_YEAR = DAYS_PER_JULIAN_YEAR * 86_400;
