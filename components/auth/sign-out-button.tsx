'use client';
import { signOut } from 'next-auth/react';
import { LogOut } from 'lucide-react';

export function SignOutButton() {
  return (
    <button type="button" className="btn-secondary" onClick={() => signOut({ callbackUrl: '/' })}>
      <LogOut aria-hidden className="h-4 w-4" />
      Sign out
    </button>
  );
}
