import { useRef, useState } from "react";
import { FileText, Trash2, Upload } from "lucide-react";
import { MATERIAL_FILE_KIND_LABELS, MATERIAL_FILE_KINDS, type MaterialFileDto, type MaterialFileKind } from "@shared/schemas/material.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { SelectField } from "@/components/ui/form/select-field";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { materialFileUrl, useDeleteMaterialFile, useUploadMaterialFile } from "../api/materials.queries";

const formatSize = (bytes: number) => (bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`);

/** The maker's technical and safety data sheets for one material: PDFs or photos, staff only. */
export function DataSheetsPanel({ materialId, files, canEdit }: { materialId: number; files: MaterialFileDto[]; canEdit: boolean }) {
  const upload = useUploadMaterialFile(materialId);
  const remove = useDeleteMaterialFile(materialId);
  const [kind, setKind] = useState<MaterialFileKind>("tds");
  const [progress, setProgress] = useState<number | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);

  const send = async (file: File | undefined) => {
    if (!file) return;
    setProblem(null);
    setProgress(0);
    try {
      await upload.mutateAsync({ file, kind, onProgress: setProgress });
      toast.success(`${MATERIAL_FILE_KIND_LABELS[kind]} uploaded`);
    } catch (error) {
      setProblem(isApiError(error) ? error.message : "The upload failed.");
    } finally {
      setProgress(null);
      if (input.current) input.current.value = "";
    }
  };

  return (
    <Panel title="Data sheets" titleId="data-sheets-heading">
      <div className="flex flex-col gap-4">
        <p className="text-sm text-primer-700">The maker&apos;s technical and safety data sheets govern; the figures in this catalogue are copied from them.</p>
        {files.length === 0 ? (
          <p className="text-sm font-medium text-ink-900">No data sheets uploaded yet.</p>
        ) : (
          <ul className="flex flex-col gap-2" aria-labelledby="data-sheets-heading">
            {files.map((f) => (
              <li key={f.id} className="flex items-center gap-3 rounded-lg border border-primer-200 px-3 py-2">
                <FileText aria-hidden className="size-5 shrink-0 text-primer-600" />
                <div className="min-w-0 flex-1">
                  <a href={materialFileUrl(materialId, f.id)} target="_blank" rel="noreferrer" className="block truncate font-semibold text-ink-900 underline underline-offset-2">
                    {MATERIAL_FILE_KIND_LABELS[f.kind]}
                  </a>
                  <span className="block truncate text-xs text-primer-700">
                    {f.originalName} · {formatSize(f.size)} · {formatDateTime(f.createdAt)}
                  </span>
                </div>
                {canEdit ? (
                  <Button
                    variant="ghost"
                    size="sm"
                    icon={<Trash2 aria-hidden className="size-4" />}
                    pending={remove.isPending && remove.variables === f.id}
                    onClick={async () => {
                      try {
                        await remove.mutateAsync(f.id);
                        toast.success("Data sheet removed");
                      } catch (error) {
                        setProblem(isApiError(error) ? error.message : "Could not remove the file.");
                      }
                    }}
                  >
                    Remove<span className="sr-only"> {MATERIAL_FILE_KIND_LABELS[f.kind]}</span>
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        )}
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        {canEdit ? (
          <div className="flex flex-col gap-3 border-t border-primer-200 pt-4">
            <SelectField label="Which sheet" value={kind} onChange={(e) => setKind(e.target.value as MaterialFileKind)}>
              {MATERIAL_FILE_KINDS.map((k) => (
                <option key={k} value={k}>
                  {MATERIAL_FILE_KIND_LABELS[k]}
                </option>
              ))}
            </SelectField>
            <div>
              <input
                ref={input}
                id={`sheet-file-${materialId}`}
                type="file"
                accept="application/pdf,image/jpeg,image/png,image/webp"
                className="sr-only"
                onChange={(e) => void send(e.target.files?.[0])}
                aria-label="Choose a PDF or image to upload"
              />
              <Button variant="secondary" onClick={() => input.current?.click()} pending={progress !== null} icon={<Upload aria-hidden className="size-4" />}>
                Upload PDF or photo
              </Button>
            </div>
            {progress !== null ? (
              <div>
                <progress className="h-2 w-full accent-candy-600" max={1} value={progress} aria-label="Upload progress" />
                <p className="mt-1 text-xs text-primer-700 tabular-nums" aria-live="polite">
                  Uploading… {Math.round(progress * 100)} %
                </p>
              </div>
            ) : null}
          </div>
        ) : null}
      </div>
    </Panel>
  );
}
