import type { ReactNode } from 'react';

/** The frame of the pages before sign-in: our mark, a title, the content. */
export function PublicPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col gap-5 px-4 py-6">
      <p className="flex items-center gap-2 text-2xl font-extrabold">
        <img src="/icons/icon.svg" alt="" width={40} height={40} className="rounded-lg" />
        Rackside
      </p>
      <h1 className="text-3xl font-extrabold">{title}</h1>
      {children}
    </main>
  );
}
