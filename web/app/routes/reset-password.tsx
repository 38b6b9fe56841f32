import { AuthFrame } from '../../components/auth-frame';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PasswordResetRequestForm } from '../../features/auth/components/password-reset-request-form';

export default function ResetPasswordRoute() {
  return (
    <AuthFrame title="Reset your password" subtitle="We will e-mail you a link to choose a new one.">
      <PasswordResetRequestForm />
      <p className="mt-4 text-center text-sm">
        <TextLink to={paths.signIn.href()}>Back to sign in</TextLink>
      </p>
    </AuthFrame>
  );
}
