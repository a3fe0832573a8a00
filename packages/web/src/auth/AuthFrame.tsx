import type { ReactNode } from 'react';
import { Logo } from '../components/Logo.js';
import { SafetyCaution } from '../components/SafetyCaution.js';

/** The frame around sign-in, invite and reset pages: a narrow card on the paper ground. */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-4 py-10">
      <div className="flex items-center gap-3 text-petrol">
        <Logo className="h-9 w-9" />
        <span className="text-xl font-semibold tracking-tight">Sigmatail</span>
      </div>
      <div className="rounded-xl border border-rule bg-sheet p-6 shadow-[0_1px_0_#d8cfba]">
        <h1 className="mb-4 text-lg font-semibold">{title}</h1>
        {children}
      </div>
      <SafetyCaution />
    </main>
  );
}
