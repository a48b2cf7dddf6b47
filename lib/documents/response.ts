/** A PDF as a download, never cached by a shared cache (papers may carry a buyer's name). */
export function pdfResponse(pdf: Buffer, filename: string): Response {
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, "-")}.pdf"`,
      "cache-control": "private, no-store",
    },
  });
}
