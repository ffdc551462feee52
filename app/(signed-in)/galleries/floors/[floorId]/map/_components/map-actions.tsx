"use client";
// Print the floor map (A4 or A3 landscape) or keep it as SVG or PNG.
import { useState } from "react";

export function MapActions({ floorId, fileName }: { floorId: number; fileName: string }) {
  const [paper, setPaper] = useState<"A4" | "A3">("A4");
  const [problem, setProblem] = useState<string | null>(null);

  async function png() {
    setProblem(null);
    try {
      const svg = await (await fetch(`/api/floors/${floorId}/map`)).text();
      const image = new Image();
      const url = URL.createObjectURL(new Blob([svg], { type: "image/svg+xml" }));
      await new Promise<void>((resolve, reject) => {
        image.onload = () => resolve();
        image.onerror = () => reject(new Error("the map could not be drawn"));
        image.src = url;
      });
      const canvas = document.createElement("canvas");
      const scale = 2400 / Math.max(image.naturalWidth || 1200, 1);
      canvas.width = Math.round((image.naturalWidth || 1200) * scale);
      canvas.height = Math.round((image.naturalHeight || 800) * scale);
      const context = canvas.getContext("2d")!;
      context.fillStyle = "#ffffff";
      context.fillRect(0, 0, canvas.width, canvas.height);
      context.drawImage(image, 0, 0, canvas.width, canvas.height);
      URL.revokeObjectURL(url);
      const link = document.createElement("a");
      link.download = `${fileName}.png`;
      link.href = canvas.toDataURL("image/png");
      link.click();
    } catch (error) {
      setProblem(`The PNG could not be made (${(error as Error).message}); download the SVG instead.`);
    }
  }

  return (
    <div className="flex flex-wrap items-end gap-2 print:hidden">
      {/* The page size of the printed sheet; landscape either way. */}
      <style>{`@page { size: ${paper} landscape; margin: 10mm; }`}</style>
      <div>
        <label htmlFor="map-paper" className="block text-sm font-semibold">Paper</label>
        <select id="map-paper" className="field-input mt-0" value={paper} onChange={(e) => setPaper(e.target.value as "A4" | "A3")}>
          <option value="A4">A4 landscape</option>
          <option value="A3">A3 landscape</option>
        </select>
      </div>
      <button type="button" className="button" onClick={() => window.print()}>Print</button>
      <a className="button-quiet" href={`/api/floors/${floorId}/map`} download={`${fileName}.svg`}>Download SVG</a>
      <button type="button" className="button-quiet" onClick={() => void png()}>Download PNG</button>
      {problem && <p role="alert" className="text-sm text-alert-700">{problem}</p>}
    </div>
  );
}
