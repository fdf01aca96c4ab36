"use client";

import jsQR from "jsqr";
import { useTranslations } from "next-intl";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";

/**
 * Reads QR codes through the phone's (or computer's) camera and hands each text to `onCode`.
 * Browsers allow the camera only on https or localhost; without it a clear message shows.
 */
export function QrScanner({ onCode }: { onCode: (text: string) => void }) {
  const t = useTranslations();
  const video = useRef<HTMLVideoElement>(null);
  const [on, setOn] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const latest = useRef(onCode);
  useEffect(() => {
    latest.current = onCode;
  }, [onCode]);

  useEffect(() => {
    if (!on) return;
    let stream: MediaStream | null = null;
    let timer: ReturnType<typeof setInterval> | undefined;
    let last = { text: "", at: 0 };
    const canvas = document.createElement("canvas");
    const context = canvas.getContext("2d", { willReadFrequently: true });
    (async () => {
      if (!navigator.mediaDevices?.getUserMedia) {
        setProblem(t("stockTake.camera.unavailable"));
        setOn(false);
        return;
      }
      try {
        stream = await navigator.mediaDevices.getUserMedia({ video: { facingMode: "environment" }, audio: false });
      } catch {
        setProblem(t("stockTake.camera.denied"));
        setOn(false);
        return;
      }
      const v = video.current;
      if (!v) return;
      v.srcObject = stream;
      await v.play().catch(() => undefined);
      timer = setInterval(() => {
        if (!context || v.readyState < 2 || !v.videoWidth) return;
        const scale = Math.min(1, 640 / v.videoWidth);
        canvas.width = Math.round(v.videoWidth * scale);
        canvas.height = Math.round(v.videoHeight * scale);
        context.drawImage(v, 0, 0, canvas.width, canvas.height);
        const image = context.getImageData(0, 0, canvas.width, canvas.height);
        const found = jsQR(image.data, image.width, image.height, { inversionAttempts: "dontInvert" });
        // The same label held in view is read many times a second: pass it on once per 2.5 s.
        if (found?.data && (found.data !== last.text || Date.now() - last.at > 2500)) {
          last = { text: found.data, at: Date.now() };
          latest.current(found.data);
        }
      }, 250);
    })();
    return () => {
      if (timer) clearInterval(timer);
      stream?.getTracks().forEach((track) => track.stop());
    };
  }, [on, t]);

  return (
    <div className="space-y-2">
      <Button
        type="button"
        variant="secondary"
        onClick={() => {
          setProblem(null);
          setOn((v) => !v);
        }}
      >
        {on ? t("stockTake.camera.stop") : t("stockTake.camera.start")}
      </Button>
      {problem ? <p className="text-sm text-amber-800">{problem}</p> : null}
      {on ? <video ref={video} muted playsInline className="aspect-video w-full max-w-md rounded-md bg-stone-900 object-cover" aria-label={t("stockTake.camera.view")} /> : null}
    </div>
  );
}
