import type { OutgoingMail } from './mail.service'

/** The wording of account mail, plain text first (every message has one); links carry the token as `?token=`. */
export function verificationMail(to: string, name: string, link: string): OutgoingMail {
  return {
    to,
    subject: 'Confirm your e-mail address for Rockerbook',
    text: [
      `Hello ${name},`,
      '',
      'Confirm this address to start sharing skaters with coaches and shops:',
      link,
      '',
      'The link works once and for 48 hours. If you did not sign up, ignore this message.',
    ].join('\n'),
  }
}

export function resetMail(to: string, name: string, link: string): OutgoingMail {
  return {
    to,
    subject: 'Set a new Rockerbook password',
    text: [
      `Hello ${name},`,
      '',
      'Someone asked to reset the password of this Rockerbook account. To choose a new one, open:',
      link,
      '',
      'The link works once and for one hour. If it was not you, ignore this message: your password stays as it is.',
    ].join('\n'),
  }
}

export function coachInvitationMail(to: string, ownerName: string, skaterName: string, link: string): OutgoingMail {
  return {
    to,
    subject: `${ownerName} shared ${skaterName} with you on Rockerbook`,
    text: [
      `${ownerName} would like you to coach ${skaterName} on Rockerbook and see their blades.`,
      '',
      'Sign in (or create a coach account with this address) and accept the invitation here:',
      link,
    ].join('\n'),
  }
}

export function technicianInvitationMail(to: string, shopName: string, link: string): OutgoingMail {
  return {
    to,
    subject: `${shopName} invites you to its Rockerbook bench`,
    text: [
      `${shopName} invites you to join it as a technician on Rockerbook.`,
      '',
      'Sign in (or create an account with this address) and accept the invitation here:',
      link,
    ].join('\n'),
  }
}
