import { useNavigate, useParams } from 'react-router-dom';
import { AuthFrame } from '../../components/auth-frame';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PasswordResetCompleteForm } from '../../features/auth/components/password-reset-complete-form';

export default function ResetPasswordCompleteRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  return (
    <AuthFrame title="Choose a new password">
      <PasswordResetCompleteForm token={token} onDone={() => navigate(paths.dashboard.href(), { replace: true })} />
      <p className="mt-4 text-center text-sm">
        <TextLink to={paths.resetPassword.href()}>Ask for a new link</TextLink>
      </p>
    </AuthFrame>
  );
}
