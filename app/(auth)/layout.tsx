export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="bench flex min-h-screen items-start justify-center px-4 py-16">
      <div className="w-full max-w-sm">
        <p className="mb-6 flex items-baseline gap-2">
          <span className="text-2xl font-bold tracking-tight">Jigboard</span>
          <span className="text-sm text-walnut-600">build · film · publish</span>
        </p>
        <div className="rounded-plank border border-timber-300 bg-white p-6 shadow-[0_2px_0_theme(colors.timber.300)]">{children}</div>
      </div>
    </main>
  );
}
