import { AuthLayout } from '../../../components/layouts/auth-layout';
import { ResetPasswordForm } from '../../../features/auth/components/reset-password-form';

export function ResetPasswordScreen() {
  return (
    <AuthLayout
      title="Reset password"
      intro="Enter the e-mail address of your account and we will send you a link to choose a new password."
    >
      <ResetPasswordForm />
    </AuthLayout>
  );
}
