import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16 text-center">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="mt-2 text-slate-700">This page does not exist, or it is not shared with your account.</p>
      <p className="mt-6">
        <Link href="/" className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
          Go to your home page
        </Link>
      </p>
    </main>
  );
}
