import { AuthLayout } from '../../../components/layouts/auth-layout';
import { SignInForm } from '../../../features/auth/components/sign-in-form';

export function SignInScreen() {
  return (
    <AuthLayout title="Sign in" intro="Welcome back to the hangar.">
      <SignInForm />
    </AuthLayout>
  );
}
