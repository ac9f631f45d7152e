import { useParams } from 'react-router-dom';
import { AuthLayout } from '../../../components/layouts/auth-layout';
import { NewPasswordForm } from '../../../features/auth/components/new-password-form';

export function ResetPasswordConfirmScreen() {
  const { token = '' } = useParams();
  return (
    <AuthLayout title="Choose a new password">
      <NewPasswordForm token={token} />
    </AuthLayout>
  );
}
