/**
 * Chapters for the video description, checked against the large video
 * platform's published rule (support.google.com/youtube/answer/9884579):
 * the first timestamp is 0:00, there are at least three, they ascend, and
 * each chapter is at least 10 seconds long.
 */
import { formatClock, framesToWholeSeconds, type Rate } from "./timecode";

export interface ChapterInput {
  segmentId: string;
  title: string;
  startFrame: number;
}

export interface Chapter {
  segmentId: string;
  title: string;
  startSeconds: number;
  line: string;
  problems: string[];
}

export interface ChapterReport {
  chapters: Chapter[];
  /** Problems that belong to the list as a whole. */
  problems: string[];
  valid: boolean;
  text: string;
}

export const MIN_CHAPTERS = 3;
export const MIN_CHAPTER_SECONDS = 10;

export function buildChapters(inputs: ChapterInput[], totalFrames: number, rate: Rate): ChapterReport {
  const total = framesToWholeSeconds(totalFrames, rate);
  const chapters: Chapter[] = inputs.map((c) => {
    const startSeconds = framesToWholeSeconds(c.startFrame, rate);
    const title = c.title.trim();
    return { segmentId: c.segmentId, title, startSeconds, line: `${formatClock(startSeconds)} ${title}`, problems: title ? [] : ["give this chapter a title"] };
  });
  const problems: string[] = [];
  if (chapters.length === 0) return { chapters, problems: ["no chapters: flag at least three segments as chapter starts"], valid: false, text: "" };
  if (chapters[0]!.startSeconds !== 0) chapters[0]!.problems.push(`the first chapter must start at 0:00, not ${formatClock(chapters[0]!.startSeconds)}`);
  if (chapters.length < MIN_CHAPTERS) problems.push(`at least ${MIN_CHAPTERS} chapters are needed; there ${chapters.length === 1 ? "is 1" : `are ${chapters.length}`}`);
  chapters.forEach((c, i) => {
    const prev = chapters[i - 1];
    if (prev && c.startSeconds <= prev.startSeconds) c.problems.push(`starts at ${formatClock(c.startSeconds)}, not after the chapter before (${formatClock(prev.startSeconds)})`);
    const nextStart = chapters[i + 1]?.startSeconds ?? total;
    const length = nextStart - c.startSeconds;
    if (length < MIN_CHAPTER_SECONDS && !(prev && c.startSeconds <= prev.startSeconds)) c.problems.push(`lasts ${Math.max(0, length)} s; a chapter needs at least ${MIN_CHAPTER_SECONDS} s`);
  });
  const valid = problems.length === 0 && chapters.every((c) => c.problems.length === 0);
  return { chapters, problems, valid, text: chapters.map((c) => c.line).join("\n") };
}
