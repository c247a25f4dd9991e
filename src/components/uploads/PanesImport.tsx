/** The library page's import of measured panes from a CSV file; the panes saved are listed after the upload. */
import UploadForm from "./UploadForm";
import type { PaneEntry } from "@/lib/contracts/library";

interface Saved {
  panes: PaneEntry[];
  sha256: string;
}

export default function PanesImport({ organizationId }: { organizationId: string }) {
  return (
    <UploadForm<Saved>
      testId="panes-import"
      action={`/api/v1/orgs/${organizationId}/panes/import`}
      noun="panes file"
      templateHref="/templates/paneray-panes-template.csv"
      help={
        <p>
          One pane a row, with its measured values as fractions (0.79, not 79 %): <code>name, thickness_mm, solar_t, solar_rf, solar_rb</code>, and if
          known <code>light_t</code> (alone, or with both <code>light_rf</code> and <code>light_rb</code>), <code>emissivity_front</code>,{" "}
          <code>emissivity_back</code> and a <code>note</code>. Nothing is saved unless every row is right.
        </p>
      }
      renderSaved={(b) => (
        <>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="imported-panes">
              <thead className="text-slate">
                <tr>
                  <th scope="col" className="py-1 pr-3">
                    Pane
                  </th>
                  <th scope="col" className="py-1">
                    Saved as
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-line">
                {b.panes.map((p) => (
                  <tr key={p.id}>
                    <td className="py-1 pr-3 font-bold">{p.name}</td>
                    <td className="py-1 font-mono text-xs">{p.description} · rev. 1</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="text-xs text-slate">
            {b.panes.length} {b.panes.length === 1 ? "pane" : "panes"} added to the library. File SHA-256{" "}
            <code className="break-all">{b.sha256}</code>
          </p>
        </>
      )}
    />
  );
}
