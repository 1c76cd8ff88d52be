// The application shell: header, the figure, and the side panels.
export function App() {
  return (
    <main>
      <h1>axband</h1>
    </main>
  );
}
