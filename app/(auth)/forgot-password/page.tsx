import { ForgotPasswordForm } from '@/components/auth/forgot-password-form';
import { forgotPasswordAction } from '../actions';

export const metadata = { title: 'Forgot password' };

export default function ForgotPasswordPage() {
  return (
    <div className="space-y-4">
      <h1>Forgot your password?</h1>
      <p className="text-ink-soft">We will e-mail you a link to choose a new one.</p>
      <ForgotPasswordForm onRequest={forgotPasswordAction} />
    </div>
  );
}
