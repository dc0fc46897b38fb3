import Link from "next/link";
import type { ReactNode } from "react";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col bg-paper">
      <header className="px-4 py-4 sm:px-6">
        <Link href="/" className="text-lg font-bold tracking-tight text-ink">
          Pedalpoint
        </Link>
      </header>
      <main id="main" className="mx-auto w-full max-w-md flex-1 px-4 pb-16 pt-4 sm:px-6">
        {children}
      </main>
    </div>
  );
}
