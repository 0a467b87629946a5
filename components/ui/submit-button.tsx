"use client";

import { useFormStatus } from "react-dom";
import { Button, type ButtonProps } from "./button";

/**
 * A submit button that shows its loading state while the enclosing <form action={…}>
 * is pending (React's useFormStatus). Same props as Button.
 */
export function SubmitButton({ loading, ...props }: ButtonProps) {
  const { pending } = useFormStatus();
  return <Button type="submit" loading={pending || loading} {...props} />;
}
