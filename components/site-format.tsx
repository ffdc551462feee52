"use client";
// The site's locale, time zone and currency for client components: the signed-in layout provides
// them once, a component reads them with useSiteFormat() and formats with lib/format.
import { createContext, useContext } from "react";
import { DEFAULT_FORMAT, type SiteFormat } from "@/lib/format";

const SiteFormatContext = createContext<SiteFormat>(DEFAULT_FORMAT);

export function SiteFormatProvider({ value, children }: { value: SiteFormat; children: React.ReactNode }) {
  return <SiteFormatContext.Provider value={value}>{children}</SiteFormatContext.Provider>;
}

export function useSiteFormat(): SiteFormat {
  return useContext(SiteFormatContext);
}
