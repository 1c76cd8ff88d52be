// The messages area: problems are announced in role="alert" elements and good news in role="status" ones
// (WAI-ARIA 1.2, roles "alert" and "status"); both can be dismissed, good news also fades by itself.
import { afterEach, beforeEach, expect, test, vi } from "vitest";
import { act, fireEvent, render, screen } from "@testing-library/react";
import { Messages } from "../../src/ui/layout/Messages";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());
afterEach(() => vi.useRealTimers());

test("alerts and status messages get their roles and can be dismissed", () => {
  render(<Messages />);
  act(() => {
    useAxband.getState().pushMessage("alert", "This link could not be opened.");
    useAxband.getState().pushMessage("status", "Link copied.");
  });
  expect(screen.getByRole("alert")).toHaveTextContent("This link could not be opened.");
  expect(screen.getByRole("status")).toHaveTextContent("Link copied.");
  fireEvent.click(screen.getAllByRole("button", { name: "Dismiss message" })[0]);
  expect(screen.queryByRole("alert")).toBeNull();
  expect(useAxband.getState().ui.messages.map((m) => m.text)).toEqual(["Link copied."]);
});

test("good news fades after a few seconds; an alert stays until dismissed", () => {
  vi.useFakeTimers();
  render(<Messages />);
  act(() => {
    useAxband.getState().pushMessage("alert", "Storage is full.");
    useAxband.getState().pushMessage("status", "Saved.");
  });
  act(() => vi.advanceTimersByTime(60_000));
  expect(screen.queryByRole("status")).toBeNull();
  expect(screen.getByRole("alert")).toHaveTextContent("Storage is full.");
});
