import Link from "next/link";
import { StatusPage } from "@/components/status-page";

export default function NotFound() {
  return (
    <StatusPage code="404" title="No such page">
      <p>Nothing lives at this address. It may have moved, or the link has a typo.</p>
      <p className="mt-4">
        <Link href="/" className="button">Go to your home</Link>
      </p>
    </StatusPage>
  );
}
