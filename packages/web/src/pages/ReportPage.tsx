export function ReportPage() {
  return <p>Coming in the next commit.</p>;
}
