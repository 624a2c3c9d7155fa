/** Empties the mail catcher so a suite starts without other suites' mail. */
export async function clearCaughtMail(maildevUrl: string): Promise<void> {
  const response = await fetch(`${maildevUrl}/api/email/all`, { method: 'DELETE' });
  if (!response.ok) throw new Error(`DELETE ${maildevUrl}/api/email/all answered ${response.status}`);
}
