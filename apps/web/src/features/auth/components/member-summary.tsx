import { ROLES, type SessionUser } from '@scrap-relay/shared';
import type { ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Panel } from '../../../components/layouts/page.tsx';
import { formatRoles } from '../../../utils/format.ts';
import { ResendVerificationButton } from './resend-verification-button.tsx';

/** The member's standing in the guild as the exchange sees it. */
export function MemberSummary({ user }: { user: SessionUser }) {
  return (
    <div className="space-y-6">
      {user.emailVerified ? null : (
        <Alert tone="warning" title="Please confirm your e-mail address" announce={false}>
          <p>
            We sent a link to <strong className="break-all">{user.email}</strong>. Open it to confirm the address is yours, so the guild can reach you
            about bundles and orders.
          </p>
          <p>
            <strong>Confirming it unlocks the exchange:</strong>{' '}
            {user.newQuilter ? 'listing a bundle, buying, and claiming starter bundles as a new quilter' : 'listing a bundle and buying'}. Until then you
            can browse the shelf.
          </p>
          <ResendVerificationButton email={user.email} label="Send the confirmation again" />
        </Alert>
      )}
      <Panel title="Your details">
        <dl className="grid gap-x-6 sm:grid-cols-[12rem_1fr] sm:gap-y-3">
          <Detail term="Name">{user.name}</Detail>
          <Detail term="E-mail">
            {user.email}{' '}
            <span className={user.emailVerified ? 'font-semibold text-sage' : 'font-semibold text-ochre'}>
              {user.emailVerified ? '(confirmed)' : '(not confirmed yet)'}
            </span>
          </Detail>
          <Detail term="Roles">{formatRoles(user.roles, ROLES)}</Detail>
          <Detail term="New quilter">
            {!user.newQuilter
              ? 'No: starter bundles are kept for new quilters.'
              : user.emailVerified
                ? 'Yes: you may claim starter bundles from the guild’s starter programme.'
                : 'Yes: once your e-mail address is confirmed, you may claim starter bundles from the guild’s starter programme.'}
          </Detail>
        </dl>
      </Panel>
    </div>
  );
}

function Detail({ term, children }: { term: string; children: ReactNode }) {
  return (
    <>
      <dt className="font-semibold text-thread-soft">{term}</dt>
      <dd className="max-sm:mb-3">{children}</dd>
    </>
  );
}
