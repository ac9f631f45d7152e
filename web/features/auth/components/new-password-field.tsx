import { TextField, type TextFieldProps } from '../../../components/ui/text-field';
import { PASSWORD_HINT } from '../validate';

/** Where a password is chosen: the browser may suggest a new one, and the rule is said. */
export function NewPasswordField({
  label = 'Password',
  ...props
}: Omit<TextFieldProps, 'label' | 'type' | 'autoComplete' | 'hint'> & { label?: string }) {
  return <TextField label={label} type="password" autoComplete="new-password" hint={PASSWORD_HINT} {...props} />;
}
