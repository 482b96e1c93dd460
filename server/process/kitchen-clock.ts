/** The kitchen's time zone, for times in words ("by 14:32"): the server's own (TZ). */
export const kitchenTimeZone = (): string => Intl.DateTimeFormat().resolvedOptions().timeZone;
