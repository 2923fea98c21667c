import { ConfigService } from '@nestjs/config';
import { DEFAULTS } from '../config/app-config';
import { intervalFrom } from '../mail/mail.settings';

export type EscortSettings = {
  /** How often reminders are looked for, in ms; 0 = no schedule (call `EscortRemindersService.run(now)` yourself). */
  reminderIntervalMs: number;
};
export const ESCORT_SETTINGS = Symbol('ESCORT_SETTINGS');
export const escortSettingsFrom = (config: ConfigService): EscortSettings => ({
  reminderIntervalMs: intervalFrom(config, 'ESCORT_REMINDER_INTERVAL_MS', DEFAULTS.ESCORT_REMINDER_INTERVAL_MS),
});
