import { describeFlag, type AlertEvent } from '@cellwarden/shared';
import type { Logger } from '../logger';
import { flagClearedMail, flagStartedMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import type { AlertsRepository } from './alerts-repository';

/** Most flag e-mails one person receives in an hour; beyond it they are skipped (the dashboard still shows all). */
export const NOTICES_PER_HOUR = 10;

const formatValue = (value: number | null, unit: string) =>
  value === null ? 'not recorded' : `${Number(value.toFixed(2))}${unit ? ` ${unit}` : ''}`;

/** E-mails the owner and named grantees when a flag starts and when it clears, if they opted in to that kind. */
export function createAlertNotices(deps: {
  repository: AlertsRepository;
  mailer: Mailer;
  logger: Logger;
  now: () => number;
}) {
  return {
    async send(alert: AlertEvent, transition: 'start' | 'end', system: { name: string; timeZone: string }) {
      const description = describeFlag(alert.kind);
      const recipients = await deps.repository.recipients(alert.systemId, deps.now());
      for (const person of recipients) {
        if (!person.emailFlags.includes(alert.kind)) continue;
        const allowance = await deps.repository.noticeAllowance(person.userId, alert.id, transition);
        if (allowance.already || allowance.lastHour >= NOTICES_PER_HOUR) continue;
        const notice = {
          systemName: system.name,
          flagTitle: description.title,
          at: transition === 'start' ? alert.startedAt : (alert.endedAt ?? deps.now()),
          value: formatValue(alert.peakValue, alert.unit),
          advice: description.whatToDo,
          timeZone: system.timeZone,
        };
        const content = transition === 'start' ? flagStartedMail(notice) : flagClearedMail(notice);
        try {
          await deps.mailer.send({ to: { name: person.displayName, address: person.email }, ...content });
          await deps.repository.recordNotice(person.userId, alert.id, transition);
        } catch (error) {
          deps.logger.warn('flag notice not sent', { alertId: alert.id, error: (error as Error).message });
        }
      }
    },
  };
}

export type AlertNotices = ReturnType<typeof createAlertNotices>;
