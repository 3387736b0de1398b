// Loopshift's mark: a rotor with its teeth, circled by an arrow that closes on itself, the loop
// the retrofit closes around the motor.
export function BrandMark({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <circle cx="16" cy="16" r="15" fill="#123433" />
      <path
        d="M16 5.5a10.5 10.5 0 1 1-9.6 6.2"
        fill="none"
        stroke="#df8142"
        strokeWidth="2.6"
        strokeLinecap="round"
      />
      <path
        d="M3.6 9.2l2.9 3.6 3.9-2.5"
        fill="none"
        stroke="#df8142"
        strokeWidth="2.4"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <circle cx="16" cy="16" r="5.2" fill="#d5ecea" />
      <g stroke="#123433" strokeWidth="1.4">
        <path d="M16 10.8v2.2M16 19v2.2M10.8 16h2.2M19 16h2.2" />
      </g>
    </svg>
  );
}

export function Wordmark({ tone = "light" }: { tone?: "light" | "dark" }) {
  return (
    <span className="flex items-center gap-2">
      <BrandMark />
      <span
        className={`text-title font-black tracking-tight ${tone === "light" ? "text-white" : "text-flux-900"}`}
      >
        Loop<span className={tone === "light" ? "text-coil-300" : "text-coil-600"}>shift</span>
      </span>
    </span>
  );
}
