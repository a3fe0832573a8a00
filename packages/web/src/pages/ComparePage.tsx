export function ComparePage() {
  return <p>Coming in the next commit.</p>;
}
