"use client";
// Runs the live re-plan in a Web Worker (plan.worker.ts): posts the newest job, keeps the answer
// to the newest job only, and says when an answer is on its way.
import { useEffect, useRef, useState } from "react";
import type { PlanAnswer, PlanJob } from "./plan-messages";

export function usePlanWorker(job: Omit<PlanJob, "id">): { answer: PlanAnswer | null; working: boolean; failure: string | null } {
  const worker = useRef<Worker | null>(null);
  const counter = useRef(0);
  const [answer, setAnswer] = useState<PlanAnswer | null>(null);
  const [working, setWorking] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  useEffect(() => {
    const instance = new Worker(new URL("./plan.worker.ts", import.meta.url), { type: "module" });
    worker.current = instance;
    instance.onmessage = (event: MessageEvent<PlanAnswer>) => {
      if (event.data.id !== counter.current) return;
      setWorking(false);
      if ("failure" in event.data) setFailure(event.data.failure);
      else {
        setFailure(null);
        setAnswer(event.data);
      }
    };
    instance.onerror = (event) => {
      setWorking(false);
      setFailure(event.message || "the plan worker stopped");
    };
    return () => {
      instance.terminate();
      worker.current = null;
    };
  }, []);

  const key = JSON.stringify(job);
  useEffect(() => {
    const instance = worker.current;
    if (!instance) return;
    counter.current += 1;
    setWorking(true);
    instance.postMessage({ ...JSON.parse(key), id: counter.current } satisfies PlanJob);
  }, [key]);

  return { answer, working, failure };
}
