/**
 * Extraterrestrial radiation for daily periods, FAO Irrigation and Drainage Paper 56
 * (Allen, Pereira, Raes and Smith, 1998), Chapter 3, Eq. 21-25.
 */

/** Solar constant Gsc, MJ m-2 min-1 (FAO-56 Eq. 21). */
export const SOLAR_CONSTANT_MJ_M2_MIN = 0.082;

/**
 * Inverse relative distance Earth-Sun, dr (FAO-56 Eq. 23).
 *
 * @param dayOfYear J, 1..365 (366)
 * @example inverseRelativeDistance(246) // 0.985 (FAO-56 Example 8)
 */
export function inverseRelativeDistance(dayOfYear: number): number {
  return 1 + 0.033 * Math.cos(((2 * Math.PI) / 365) * dayOfYear);
}

/**
 * Solar declination delta, rad (FAO-56 Eq. 24).
 *
 * @example solarDeclination(246) // 0.120 (FAO-56 Example 8)
 */
export function solarDeclination(dayOfYear: number): number {
  return 0.409 * Math.sin(((2 * Math.PI) / 365) * dayOfYear - 1.39);
}

/**
 * Sunset hour angle omega_s, rad (FAO-56 Eq. 25). Beyond the polar circles the cosine argument
 * leaves [-1, 1]; it is clamped, which gives 0 (polar night) or pi (midnight sun).
 *
 * @param latitudeRad latitude, rad, positive north
 * @param declinationRad solar declination, rad
 * @example sunsetHourAngle(-20 * Math.PI / 180, 0.120) // 1.527 (FAO-56 Example 8)
 */
export function sunsetHourAngle(latitudeRad: number, declinationRad: number): number {
  const x = -Math.tan(latitudeRad) * Math.tan(declinationRad);
  return Math.acos(Math.max(-1, Math.min(1, x)));
}

/**
 * Daily extraterrestrial radiation Ra, MJ m-2 d-1 (FAO-56 Eq. 21).
 *
 * @param latitudeDeg latitude in decimal degrees, positive north, negative south
 * @param dayOfYear J, 1 on 1 January
 * @example extraterrestrialRadiation(-20, 246) // about 32.2 (FAO-56 Example 8, 3 September)
 */
export function extraterrestrialRadiation(latitudeDeg: number, dayOfYear: number): number {
  const phi = (latitudeDeg * Math.PI) / 180;
  const dr = inverseRelativeDistance(dayOfYear);
  const delta = solarDeclination(dayOfYear);
  const ws = sunsetHourAngle(phi, delta);
  const ra =
    ((24 * 60) / Math.PI) *
    SOLAR_CONSTANT_MJ_M2_MIN *
    dr *
    (ws * Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.sin(ws));
  return ra > 0 ? ra : 0;
}

/**
 * Daylight hours N (FAO-56 Eq. 34).
 *
 * @example daylightHours(50.8, 187) // about 16.1 (FAO-56 Example 18, 50 deg 48 min N, 6 July)
 */
export function daylightHours(latitudeDeg: number, dayOfYear: number): number {
  const phi = (latitudeDeg * Math.PI) / 180;
  return (24 / Math.PI) * sunsetHourAngle(phi, solarDeclination(dayOfYear));
}

/** Radiation to equivalent evaporation, mm per MJ m-2 (FAO-56 Eq. 20: 1 / lambda = 0.408). */
export const MM_PER_MJ_M2 = 0.408;
