// A sidebar section keeps the open state the user left it in across a reload (issue: the figure settings
// section collapsed on every reload).
import { beforeEach, expect, test } from "vitest";
import { fireEvent, render, screen } from "@testing-library/react";
import { Section } from "../../src/ui/layout/Section";

beforeEach(() => localStorage.clear());

const details = () => screen.getByText("Figure settings").closest("details")!;

test("a section closed by default stays open after a reload once the user opened it, and closed once closed", () => {
  const page = render(
    <Section title="Figure settings" id="section-figure" open={false}>
      <p>settings</p>
    </Section>,
  );
  expect(details().open).toBe(false);
  details().open = true;
  fireEvent(details(), new Event("toggle"));
  page.unmount();

  const reloaded = render(
    <Section title="Figure settings" id="section-figure" open={false}>
      <p>settings</p>
    </Section>,
  );
  expect(details().open).toBe(true);
  details().open = false;
  fireEvent(details(), new Event("toggle"));
  reloaded.unmount();

  render(
    <Section title="Figure settings" id="section-figure" open={false}>
      <p>settings</p>
    </Section>,
  );
  expect(details().open).toBe(false);
});
