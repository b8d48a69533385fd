import { Compass } from "lucide-react";
import { ButtonLink } from "@/components/ui/button";
import { Brand } from "@/components/ui/brand";
import { paths } from "@/config/paths";

export function NotFoundPage() {
  return (
    <main id="main" className="mx-auto flex min-h-dvh max-w-lg flex-col items-center justify-center gap-6 px-6 text-center">
      <title>Page not found · Coatwright</title>
      <Brand tone="dark" />
      <Compass aria-hidden className="size-12 text-candy-600" />
      <div>
        <h1 className="text-3xl font-bold text-ink-950">Page not found</h1>
        <p className="mt-2 text-primer-700">There is nothing at this address. It may have moved, or the link has a typo.</p>
      </div>
      <ButtonLink to={paths.home} size="lg">
        Go to my start page
      </ButtonLink>
    </main>
  );
}

