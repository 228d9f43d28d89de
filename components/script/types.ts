export interface SegmentDto {
  id: string;
  position: number;
  kind: "to_camera" | "voice_over" | "sponsor_read" | "on_screen_text";
  text: string;
  stepId: string | null;
  pinnedStartFrame: number | null;
  explicitDurationFrames: number | null;
  editorNotes: string;
  chapterStart: boolean;
  chapterTitle: string | null;
  version: number;
  updatedBy: string | null;
  updatedAt: string;
}

export interface ScriptDto {
  rate: { id: string; dropFrame: boolean; num: number; den: number };
  wordsPerMinute: number;
  segments: SegmentDto[];
}

export { ApiError as SaveError, send } from "@/components/fetch-json";
