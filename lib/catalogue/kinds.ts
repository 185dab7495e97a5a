import { KIND_LABELS } from "@/lib/vocabulary";

export function kindLabel(kind: string): string {
  return (KIND_LABELS as Record<string, string>)[kind] ?? kind;
}
