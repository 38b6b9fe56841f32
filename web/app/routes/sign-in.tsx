import { useNavigate, useSearchParams } from 'react-router-dom';
import { AuthFrame } from '../../components/auth-frame';
import { safeRedirectTarget } from '../../config/paths';
import { SignInForm } from '../../features/auth/components/sign-in-form';

export default function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const target = safeRedirectTarget(params.get('redirectTo'));
  return (
    <AuthFrame title="Sign in" subtitle="Welcome back to your group's timing workspace.">
      <SignInForm onSignedIn={() => navigate(target, { replace: true })} />
    </AuthFrame>
  );
}
