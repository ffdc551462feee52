import { forbidden } from "next/navigation";

export const dynamic = "force-dynamic";

// The proxy rewrites a page its role may not open to here; forbidden() answers 403 with app/forbidden.tsx.
export default function ForbiddenRoute(): never {
  forbidden();
}
