/** A zone that never eats has starved "for ever"; a year is as good (the late loss is reached within weeks). */
export const MAX_SETTLED_CLOCK_DAYS = 365;
