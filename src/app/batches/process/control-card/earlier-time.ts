/**
 * The moment a reading was taken from the time of day a cook types ("14:05"): today, or
 * yesterday when that time is still to come (a reading from before midnight entered after it).
 * @returns the moment, or null for a time that cannot be read
 */
export function earlierTime(hhmm: string, now: Date): Date | null {
  const match = /^(\d{1,2}):(\d{2})$/.exec(hhmm.trim());
  if (!match) return null;
  const hours = Number(match[1]);
  const minutes = Number(match[2]);
  if (hours > 23 || minutes > 59) return null;
  const moment = new Date(now);
  moment.setHours(hours, minutes, 0, 0);
  if (moment.getTime() > now.getTime()) moment.setDate(moment.getDate() - 1);
  return moment;
}
