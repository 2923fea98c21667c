import { createHash, randomBytes } from 'node:crypto';
import { zonedTimeToUtc } from '@amberline/common';

/** 32 random bytes (256 bits), base64url: 43 characters. */
export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;
export const LINK_LIFETIME_MS = 7 * 86_400_000;

export const newToken = (): string => randomBytes(32).toString('base64url');
export const hashToken = (token: string): string => createHash('sha256').update(token, 'utf8').digest('hex');

/** Midnight at the start of the departure day, in the time zone of the route's first segment. */
export function departureInstant(departure: string, timeZone: string): Date {
  return new Date(zonedTimeToUtc(Date.parse(`${departure}T00:00:00Z`) / 86_400_000, 0, timeZone));
}

/** A link lives 7 days, or until departure when that comes first. */
export function linkExpiry(now: Date, departure: string, timeZone: string): Date {
  return new Date(Math.min(now.getTime() + LINK_LIFETIME_MS, departureInstant(departure, timeZone).getTime()));
}
