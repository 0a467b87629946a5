"use client";
/** The reproduction snippets of a run in tabs (curl, Python, TypeScript). */
import { useOrigin } from "@/lib/hooks/use-origin";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { CodeBlock } from "@/components/ui/code-block";
import { Tabs } from "@/components/ui/tabs";
import type { Run } from "@/lib/swr/types";
import { reproductionSnippets } from "./snippets";

export function ReproduceCard({ run }: { run: Run }) {
  const origin = useOrigin("http://localhost:3000");
  const body = { name: run.name, ...run.request, seed: run.seed };
  const s = reproductionSnippets(origin, body);
  return (
    <Card>
      <CardHeader
        eyebrow="Reproduce"
        title="This exact run through the API"
        description={
          <>
            Same request, same seed ({run.seed}), same numbers. Create a key under API keys and
            export it as <code className="font-mono text-[12px]">KETWISE_API_KEY</code>.
          </>
        }
      />
      <CardBody>
        <Tabs
          label="Snippet language"
          items={[
            {
              id: "curl",
              label: "curl",
              content: <CodeBlock code={s.curl} title="run.sh" maxHeight="22rem" />,
            },
            {
              id: "python",
              label: "Python",
              content: <CodeBlock code={s.python} title="run.py" maxHeight="22rem" />,
            },
            {
              id: "ts",
              label: "TypeScript",
              content: <CodeBlock code={s.typescript} title="run.ts" maxHeight="22rem" />,
            },
          ]}
        />
      </CardBody>
    </Card>
  );
}
