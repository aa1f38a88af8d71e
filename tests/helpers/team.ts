import { ApiClient, signedInClient, uniqueEmail } from './api-client';
import type { SmtpFake } from './smtp-fake';

/** Invites a new person with `role` by e-mail, reads the link from the fake mail server, and accepts it. */
export async function joinByInvitation(baseUrl: string, smtp: SmtpFake, owner: ApiClient, role: string) {
  const email = uniqueEmail(role);
  const invited = await owner.post('/api/invitations', { email, role });
  if (invited.status !== 201) throw new Error(`invite failed: ${invited.status} ${JSON.stringify(invited.body)}`);
  const mail = await smtp.waitFor((m) => m.to.includes(email));
  const token = /token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
  const person = await signedInClient(baseUrl, { email });
  const accepted = await person.client.post('/api/invitations/accept', { token });
  if (accepted.status !== 200) throw new Error(`accept failed: ${accepted.status}`);
  return person;
}

export interface TeamOfFour {
  teamId: string;
  owner: ApiClient;
  chief: ApiClient;
  tech: ApiClient;
  viewer: ApiClient;
}

/** Reads the verification link mailed at sign-up to `email` and follows it, as the person would. */
export async function verifyAddressByMail(baseUrl: string, smtp: SmtpFake, email: string): Promise<void> {
  const mail = await smtp.waitFor((m) => m.to.includes(email) && m.subject.includes('Confirm your address'));
  const token = /verify-email\?token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
  const confirmed = await new ApiClient(baseUrl).post('/api/email-verifications/confirm', { token });
  if (confirmed.status !== 200) throw new Error(`verification failed: ${confirmed.status}`);
}

/** A fresh team with one person in each role; every address verified (the owner's through its mail). */
export async function makeTeamOfFour(baseUrl: string, smtp: SmtpFake, name: string): Promise<TeamOfFour> {
  const owner = await signedInClient(baseUrl, { team: name });
  await verifyAddressByMail(baseUrl, smtp, owner.email);
  const chief = await joinByInvitation(baseUrl, smtp, owner.client, 'crew-chief');
  const tech = await joinByInvitation(baseUrl, smtp, owner.client, 'technician');
  const viewer = await joinByInvitation(baseUrl, smtp, owner.client, 'viewer');
  return { teamId: owner.teamId!, owner: owner.client, chief: chief.client, tech: tech.client, viewer: viewer.client };
}
