import Link from "next/link";
import { Wordmark } from "@/components/shell/brand-mark";
import { buttonClass } from "@/components/ui/button";

export default function NotFound() {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-6 bg-steel-50 px-4 text-center">
      <Wordmark tone="dark" />
      <div>
        <h1 className="text-headline">Page not found</h1>
        <p className="mt-2 text-steel-700">
          There is nothing here, or it is not open to your role.
        </p>
      </div>
      <Link href="/" className={buttonClass("primary")}>
        Go to your home page
      </Link>
    </main>
  );
}
