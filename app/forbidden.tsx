import Link from "next/link";
import { StatusPage } from "@/components/status-page";

export default function Forbidden() {
  return (
    <StatusPage code="403" title="Not for your role">
      <p>Your role does not open this page. If you need it, ask an administrator to change your role.</p>
      <p className="mt-4">
        <Link href="/" className="button">Go to your home</Link>
      </p>
    </StatusPage>
  );
}
