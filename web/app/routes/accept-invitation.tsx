import { useNavigate, useParams } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { AuthFrame } from '../../components/auth-frame';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { roleLabel } from '../../config/permissions';
import { isApiError } from '../../lib/api-client';
import { useInvitation } from '../../features/invitations/api/get-invitation';
import { AcceptInvitationForm } from '../../features/invitations/components/accept-invitation-form';

export const INVITATION_GONE_MESSAGE = 'This invitation is no longer valid';

export default function AcceptInvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);

  if (invitation.isPending) {
    return (
      <AuthFrame title="Your invitation">
        <LoadingPanel label="Checking the invitation…" />
      </AuthFrame>
    );
  }
  if (invitation.isError) {
    const gone = isApiError(invitation.error) && invitation.error.status === 404;
    return (
      <AuthFrame title={gone ? INVITATION_GONE_MESSAGE : 'Your invitation'}>
        {gone ? (
          <Alert tone="error">It may have been used already or have expired. Ask your administrator to send a new one.</Alert>
        ) : (
          <ErrorPanel error={invitation.error} onRetry={() => void invitation.refetch()} />
        )}
        <p className="mt-4 text-center text-sm">
          <TextLink to={paths.signIn.href()}>Go to sign in</TextLink>
        </p>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame
      title="Join Pulsekeeper"
      subtitle={
        <>
          You are invited as <span className="font-medium text-ember-300">{roleLabel(invitation.data.role)}</span> with{' '}
          <span className="font-mono text-night-100">{invitation.data.email}</span>.
        </>
      }
    >
      <AcceptInvitationForm token={token} onAccepted={() => navigate(paths.dashboard.href(), { replace: true })} />
    </AuthFrame>
  );
}
