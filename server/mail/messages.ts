/**
 * The e-mails Phaseloom sends, as plain text: an invitation to a bench, a password-reset link, and
 * the opt-in "analysis finished" notice. Our own wording; links are absolute (mailer.publicBaseUrl).
 */
import type { MailMessage } from './mailer';

const utc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

export function invitationMail(m: {
  to: string;
  benchName: string;
  inviterName: string;
  role: string;
  link: string;
  expiresAt: Date;
}): MailMessage {
  return {
    to: m.to,
    subject: `You are invited to the bench "${m.benchName}" on Phaseloom`,
    text: [
      `${m.inviterName} invites you to join the bench "${m.benchName}" on Phaseloom as ${m.role}.`,
      '',
      'Open this link to accept (it works once, until ' + utc(m.expiresAt) + '):',
      m.link,
      '',
      'If you have no Phaseloom account yet, the link lets you create one with this address.',
      'If you did not expect this, ignore this message; nothing happens unless the link is opened.',
    ].join('\n'),
  };
}

export function passwordResetMail(m: { to: string; link: string; expiresAt: Date }): MailMessage {
  return {
    to: m.to,
    subject: 'Choose a new Phaseloom password',
    text: [
      'Someone asked to choose a new password for the Phaseloom account with this address.',
      '',
      `Open this link to choose it (it works once, until ${utc(m.expiresAt)}):`,
      m.link,
      '',
      'Choosing a new password signs the account out everywhere else.',
      'If you did not ask for this, ignore this message; your password stays as it is.',
    ].join('\n'),
  };
}

export function analysisFinishedMail(m: {
  to: string;
  fileName: string;
  benchName: string;
  status: 'done' | 'failed';
  error: string | null;
  link: string;
}): MailMessage {
  const outcome = m.status === 'done' ? 'is ready' : 'failed';
  return {
    to: m.to,
    subject: `Analysis of ${m.fileName} ${outcome}`,
    text: [
      `The analysis of ${m.fileName} on the bench "${m.benchName}" ${outcome}.`,
      ...(m.status === 'failed' && m.error ? ['', `Reason: ${m.error}`] : []),
      '',
      m.link,
      '',
      'You get this notice because you turned on "analysis finished" e-mails in your account settings.',
    ].join('\n'),
  };
}
