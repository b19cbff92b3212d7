import type { Locale } from '@/entities/base';

/** Mail texts in the recipient's language, with the other language below (kitchens are often bilingual). */
const T = {
  invite: {
    en: (org: string, role: string, link: string) => ({
      subject: `You are invited to ${org} on Hearthcast`,
      body: `You have been invited to join ${org} on Hearthcast as ${role}.\n\nSet your password here (the link works once and expires in 7 days):\n${link}\n\nIf you did not expect this, ignore this message.`,
    }),
    fr: (org: string, role: string, link: string) => ({
      subject: `Invitation à rejoindre ${org} sur Hearthcast`,
      body: `Vous êtes invité·e à rejoindre ${org} sur Hearthcast en tant que ${role}.\n\nChoisissez votre mot de passe ici (lien à usage unique, valable 7 jours) :\n${link}\n\nSi vous n'attendiez pas ce message, ignorez-le.`,
    }),
  },
  reset: {
    en: (link: string) => ({
      subject: 'Reset your Hearthcast password',
      body: `Someone asked to reset the password of this account.\n\nChoose a new password here (the link works once and expires in 1 hour):\n${link}\n\nIf it was not you, ignore this message; your password stays the same.`,
    }),
    fr: (link: string) => ({
      subject: 'Réinitialiser votre mot de passe Hearthcast',
      body: `Une demande de réinitialisation du mot de passe de ce compte a été faite.\n\nChoisissez un nouveau mot de passe ici (lien à usage unique, valable 1 heure) :\n${link}\n\nSi ce n'était pas vous, ignorez ce message ; votre mot de passe ne change pas.`,
    }),
  },
};

const ROLE_NAMES: Record<Locale, Record<string, string>> = {
  en: { coordinator: 'coordinator', lead: 'kitchen lead', cook: 'cook' },
  fr: { coordinator: 'coordinateur·rice', lead: 'responsable de cuisine', cook: 'cuisinier·ère' },
};

function bilingual(locale: Locale, en: { subject: string; body: string }, fr: { subject: string; body: string }) {
  const [first, second] = locale === 'fr' ? [fr, en] : [en, fr];
  return { subject: first.subject, text: `${first.body}\n\n———\n\n${second.body}\n` };
}

export function inviteMail(locale: Locale, org: string, role: string, link: string) {
  return bilingual(locale, T.invite.en(org, ROLE_NAMES.en[role] ?? role, link), T.invite.fr(org, ROLE_NAMES.fr[role] ?? role, link));
}

export function resetMail(locale: Locale, link: string) {
  return bilingual(locale, T.reset.en(link), T.reset.fr(link));
}
