"use client";

import { Button } from "./button";

/** A submit button that asks first; the form is not sent unless the person confirms. */
export function ConfirmButton({ question, ...props }: React.ComponentProps<typeof Button> & { question: string }) {
  return (
    <Button
      type="submit"
      {...props}
      onClick={(event) => {
        if (!window.confirm(question)) event.preventDefault();
      }}
    />
  );
}
