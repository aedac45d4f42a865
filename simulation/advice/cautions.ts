/**
 * Cautions every piece of advice carries (product brief point 10; common-rules). Wording is
 * Shoalshift's own.
 */

/** Said beside every forecast and every piece of advice. */
export const ESTIMATE_CAUTIONS: readonly string[] = Object.freeze([
  'This is an estimate from a model of your tank; your water tests decide. Test on the check days and act on the readings.',
  'If total ammonia or nitrite reads high, change 25–50 % of the water with temperature-matched, dechlorinated water and stop feeding for a day, then test again.',
  'For questions about fish health, ask a qualified aquatic veterinarian.',
]);

/** Handling ammonia solutions and ammonium chloride: said beside any ammonia dose and on the dose form. */
export const AMMONIA_HANDLING_CAUTIONS: readonly string[] = Object.freeze([
  'Ammonia solutions and ammonium chloride are irritants: wear gloves and eye protection, and work in a ventilated place.',
  'Use only pure ammonia (ammonia and water, nothing else) or pure ammonium chloride: no surfactants, perfume, dye or "cleaning" additives.',
  'Keep the products out of reach of children and pets, in their labelled containers.',
  'Follow the product label and your local rules for storage and disposal.',
]);

/** Dosing a tank that holds fish: said beside a dose with fish present, and on the dose form for such a tank. */
export const DOSING_WITH_FISH_CAUTIONS: readonly string[] = Object.freeze([
  'With fish in the tank, every dose raises the ammonia they swim in: dose only as far as the forecast stays under the limits, split the day\'s amount or give it continuously, test daily, and stop dosing if ammonia or nitrite reads high.',
]);

/** Said beside any ammonia dose. */
export const DOSING_CAUTIONS: readonly string[] = Object.freeze([
  ...AMMONIA_HANDLING_CAUTIONS,
  'Dose into the tank only while fish are absent, or while the forecast stays under the limits; measure doses — never pour by eye.',
]);

/** Said beside advice that removes or rehomes fish. */
export const REHOMING_CAUTIONS: readonly string[] = Object.freeze([
  'Rehome fish to another keeper, a club or a shop: never release them into the wild. Follow your local rules.',
]);

/** Said beside water-change advice. */
export const WATER_CHANGE_CAUTIONS: readonly string[] = Object.freeze([
  'Treat new water with a dechlorinator that handles chloramine, and match its temperature to the tank.',
]);
