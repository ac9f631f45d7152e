import { AuthLayout } from '../../../components/layouts/auth-layout';
import { CreateAccountForm } from '../../../features/auth/components/create-account-form';

export function CreateAccountScreen() {
  return (
    <AuthLayout title="Create account" intro="Keep your models' setups, their history and their reviews in one place.">
      <CreateAccountForm />
    </AuthLayout>
  );
}
