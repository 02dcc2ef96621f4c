import { SignUpForm } from '@/components/auth/sign-up-form';
import { signUpAction } from '../actions';

export const metadata = { title: 'Create an account' };

export default function SignUpPage() {
  return (
    <div className="space-y-4">
      <h1>Create an account</h1>
      <p className="text-ink-soft">Follow your orders and see where the honey in your jars came from.</p>
      <SignUpForm onSignUp={signUpAction} />
    </div>
  );
}
