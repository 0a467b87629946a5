"use client";
/**
 * The circuit outline (diagram data and inputs) from the server action, refreshed when
 * the circuit or its parameter values change, debounced. A failed parse keeps the last
 * good outline (marked stale) so the diagram does not flicker while the user types.
 */
import { useEffect, useRef, useState } from "react";
import { circuitOutlineAction } from "@/app/(app)/app/runs/new/actions";
import type { CircuitOutline } from "@/components/circuit-diagram/outline";
import { useDebounced } from "@/lib/swr/use-debounced";

export function useCircuitOutline(
  format: "qasm2" | "qasm3",
  source: string,
  parameters: Record<string, number>,
) {
  const key = useDebounced(JSON.stringify({ format, source, parameters }), 350);
  const [outline, setOutline] = useState<CircuitOutline | null>(null);
  const [stale, setStale] = useState(false);
  const seq = useRef(0);

  useEffect(() => {
    const mine = ++seq.current;
    const input = JSON.parse(key) as {
      format: "qasm2" | "qasm3";
      source: string;
      parameters: Record<string, number>;
    };
    if (!input.source.trim()) return;
    circuitOutlineAction(input)
      .then((answer) => {
        if (mine !== seq.current) return;
        if (answer.ok) {
          setOutline(answer.outline);
          setStale(false);
        } else setStale(true);
      })
      .catch(() => {
        if (mine === seq.current) setStale(true);
      });
  }, [key]);

  // An empty editor has no outline, whatever the last answer was.
  return { outline: source.trim() ? outline : null, stale };
}
