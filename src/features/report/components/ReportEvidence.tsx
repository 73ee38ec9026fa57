import { fileSize } from '../../../../shared/presentation/figures';
import { formatDateTime } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import type { EvidenceFile } from '../report-facts';

/** The files the version carries, each identified by its SHA-256 (ISO/IEC 17025 7.8.2.1). */
export function EvidenceList({ files }: { files: readonly EvidenceFile[] }) {
  if (!files.length) return <p className="text-sm text-stone-600">No evidence is attached to this version.</p>;
  return (
    <>
      <p className="mb-1 text-xs text-stone-600">Files kept with this version. Each is identified by its SHA-256: a copy whose digest differs is not the file this version carries.</p>
      <ul className="flex flex-col gap-1.5" data-testid="report-evidence">
        {files.map((e) => (
          <li key={e.id} className="break-inside-avoid rounded-md border border-stone-300 px-3 py-1.5 text-xs">
            <p className="flex items-baseline justify-between gap-3">
              <span className="num break-all font-semibold text-stone-900">{e.fileName}</span>
              <span className="num whitespace-nowrap text-stone-700">{fileSize(e.size).text}</span>
            </p>
            <p className="text-stone-700">
              {e.symbol === null ? (
                'for the whole budget'
              ) : (
                <>
                  for <Sym s={e.symbol} />
                </>
              )}{' '}
              · added to version {e.versionNumber} by {e.uploaderName}, {formatDateTime(e.createdAt)}
            </p>
            <p className="break-all text-stone-600">
              SHA-256 <span className="num text-[10px] text-stone-900">{e.sha256}</span>
            </p>
          </li>
        ))}
      </ul>
    </>
  );
}
