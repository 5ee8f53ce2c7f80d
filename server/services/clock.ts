/** The time source services read, injectable so expiry can be tested. */
export type Clock = () => Date;

export const systemClock: Clock = () => new Date();

/** ISO 8601 in UTC with milliseconds: fixed width, so such strings sort as the times they name. */
export function iso(date: Date): string {
  return date.toISOString();
}

export function addMinutes(date: Date, minutes: number): Date {
  return new Date(date.getTime() + minutes * 60_000);
}
