import type { Metadata } from "next";
import Link from "next/link";
import { CatalogueRowActions } from "@/components/catalogue/row-actions";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { NumberTd, Table, Td, Th } from "@/components/ui/table";
import { listKits, listMotors } from "@/db/queries/catalogue";
import { requirePageUser } from "@/server/auth";
import { currencyMinorUnits, roundMoney } from "@/lib/engine/money";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Catalogue" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

// One locale for every figure, so that a table reads the same whatever the server's locale is.
const LOCALE = "en-GB";

function first(v: string | string[] | undefined) {
  return Array.isArray(v) ? v[0] : v;
}

/**
 * A price from its decimal string, never through a float: roundMoney rounds half-even to the
 * currency's minor unit (docs/model.md), the whole part is grouped as a BigInt, and Intl only
 * supplies where the symbol, separators and digits go.
 */
function formatPrice(price: string, currency: string) {
  const places = currencyMinorUnits(currency);
  const [whole, fraction = ""] = roundMoney(price, currency).split(".");
  const grouped = new Intl.NumberFormat(LOCALE).format(BigInt(whole));
  return new Intl.NumberFormat(LOCALE, {
    style: "currency",
    currency,
    minimumFractionDigits: places,
    maximumFractionDigits: places,
  })
    .formatToParts(0)
    .map((part) =>
      part.type === "integer" ? grouped : part.type === "fraction" ? fraction : part.value,
    )
    .join("");
}

// A fixed minimum of decimals lines the column's figures up on their decimal point.
function formatNumber(value: number, minFractionDigits: number, maxFractionDigits: number) {
  return new Intl.NumberFormat(LOCALE, {
    minimumFractionDigits: minFractionDigits,
    maximumFractionDigits: maxFractionDigits,
  }).format(value);
}

// Name and code share a cell: the table has to fit beside the navigation with all its figures.
function NameCell({ name, code, active }: { name: string; code: string; active: boolean }) {
  return (
    <Td className="min-w-[9rem]">
      <span className="block font-bold">{name}</span>
      <span className="mt-0.5 flex flex-wrap items-center gap-2">
        <code className="font-mono text-caption text-steel-700">{code}</code>
        {active ? null : <Badge tone="caution">Retired</Badge>}
      </span>
    </Td>
  );
}

// What a value left blank means; muted but still AA on white (steel-600 is 6.6:1).
function Fallback({ children }: { children: string }) {
  return <span className="block text-balance text-caption text-steel-600">{children}</span>;
}

function HelpList({ items }: { items: [term: string, text: string][] }) {
  return (
    <dl className="mt-4 grid gap-x-6 gap-y-2 text-small text-steel-700 md:grid-cols-2">
      {items.map(([term, text]) => (
        <div key={term}>
          <dt className="inline font-bold text-steel-800">{term}: </dt>
          <dd className="inline">{text}</dd>
        </div>
      ))}
    </dl>
  );
}

// The defaults below are those of KitInput and MotorInput in docs/model.md.
const KIT_HELP: [string, string][] = [
  ["Price", "per axis, before any discount of the case; the business case keeps it exact."],
  [
    "Sensing",
    "an encoder closes the loop at every speed; sensorless estimates the rotor position from the back-EMF, so below its minimum speed (60 rpm unless set) it runs open loop at full current.",
  ],
  [
    "Kit motor",
    "a new closed-loop motor that replaces the axis motor; “keeps the axis motor” means the kit drives the motor already on the axis.",
  ],
  [
    "Max current",
    "the peak current per phase the kit's drive may give; left blank, the engine uses √2 × the rated current of the motor the kit drives.",
  ],
  [
    "Bus voltage",
    "the supply voltage of the kit's drive, which limits the current it can push at speed; left blank, the axis drive's bus voltage is kept.",
  ],
  ["Efficiency", "of the kit's drive electronics, 92 % unless set."],
  [
    "Standby",
    "what the drive draws while powered, 3 W unless set; an encoder adds 0.5 W unless set (none when sensorless).",
  ],
];

const MOTOR_HELP: [string, string][] = [
  ["Frame size", "the NEMA flange size: NEMA 23 has a flange of about 2.3 in."],
  ["Holding torque", "with both phases at rated current, as datasheets give it."],
  ["Rated current", "per phase."],
  ["Resistance", "of one phase at 20 °C."],
  ["Inductance", "of one phase."],
  [
    "Insulation class",
    "the winding’s temperature limit (IEC 60085): B 130 °C, F 155 °C, H 180 °C.",
  ],
];

export default async function CataloguePage({ searchParams }: { searchParams: SearchParams }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const showRetired = first((await searchParams).retired) === "1";
  const isAdmin = user.role === "admin";
  const kits = listKits(user, { includeRetired: showRetired });
  const motors = listMotors(user, { includeRetired: showRetired });
  // A kit may still name a retired motor, so its name comes from the full list.
  const motorNames = new Map(
    listMotors(user, { includeRetired: true }).map((m) => [m.id, m.name] as const),
  );

  return (
    <div className="space-y-8">
      <PageHeader
        title="Catalogue"
        lead="The closed-loop kits Loopshift proposes, and the open-loop motors they are compared with. Every case reads its kits and motors from here."
        actions={
          <Link
            href={showRetired ? "/catalogue" : "/catalogue?retired=1"}
            className={buttonClass("secondary")}
          >
            {showRetired ? "Hide retired" : "Show retired"}
          </Link>
        }
      />

      <Panel
        title="Closed-loop retrofit kits"
        actions={
          isAdmin ? (
            <Link href="/catalogue/kits/new" className={buttonClass("primary", "sm")}>
              Add kit
            </Link>
          ) : null
        }
      >
        {kits.length === 0 ? (
          <EmptyState title="No kits yet">
            {isAdmin ? "Add the first kit to propose it in cases." : "An administrator adds them."}
          </EmptyState>
        ) : (
          <Table caption="Closed-loop retrofit kits">
            <thead>
              <tr>
                <Th>Name and code</Th>
                <Th className="text-right">Price</Th>
                <Th>Sensing</Th>
                <Th>Kit motor</Th>
                <Th className="text-right">Max current (A, peak)</Th>
                <Th className="text-right">Bus voltage (V)</Th>
                <Th className="text-right">Efficiency (%)</Th>
                <Th className="text-right">Standby (W)</Th>
                {isAdmin ? <Th>Change</Th> : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {kits.map((k) => (
                <tr key={k.id} data-testid={`kit-${k.code}`}>
                  <NameCell name={k.name} code={k.code} active={k.active} />
                  <NumberTd>{formatPrice(k.price, k.currency)}</NumberTd>
                  <Td>{k.sensing === "encoder" ? "Encoder" : "Sensorless"}</Td>
                  <Td className="min-w-[7rem]">
                    {k.motorId == null ? (
                      <Fallback>keeps the axis motor</Fallback>
                    ) : (
                      (motorNames.get(k.motorId) ?? "a motor no longer listed")
                    )}
                  </Td>
                  <Td className="min-w-[7.5rem] text-right tabular-nums">
                    {k.maxCurrentPeakA == null ? (
                      <Fallback>√2 × rated current of the motor</Fallback>
                    ) : (
                      formatNumber(k.maxCurrentPeakA, 1, 2)
                    )}
                  </Td>
                  <Td className="text-right tabular-nums">
                    {k.busVoltageV == null ? (
                      <Fallback>the axis drive’s</Fallback>
                    ) : (
                      formatNumber(k.busVoltageV, 0, 1)
                    )}
                  </Td>
                  <Td className="text-right tabular-nums">{formatNumber(k.efficiencyPct, 0, 1)}</Td>
                  <Td className="text-right tabular-nums">{formatNumber(k.standbyW, 0, 2)}</Td>
                  {isAdmin ? (
                    <Td>
                      <CatalogueRowActions kind="kit" id={k.id} code={k.code} active={k.active} />
                    </Td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </Table>
        )}
        <HelpList items={KIT_HELP} />
      </Panel>

      <Panel
        title="Reference open-loop motors"
        actions={
          isAdmin ? (
            <Link href="/catalogue/motors/new" className={buttonClass("primary", "sm")}>
              Add motor
            </Link>
          ) : null
        }
      >
        {motors.length === 0 ? (
          <EmptyState title="No motors yet">
            {isAdmin
              ? "Add the motors found on customers' axes, or brought by kits."
              : "An administrator adds them."}
          </EmptyState>
        ) : (
          <Table caption="Reference open-loop motors">
            <thead>
              <tr>
                <Th>Name and code</Th>
                <Th>Frame size</Th>
                <Th className="text-right">Holding torque (N·m)</Th>
                <Th className="text-right">Rated current (A)</Th>
                <Th className="text-right">Resistance (Ω)</Th>
                <Th className="text-right">Inductance (mH)</Th>
                <Th>Insulation class</Th>
                {isAdmin ? <Th>Change</Th> : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {motors.map((m) => (
                <tr key={m.id} data-testid={`motor-${m.code}`}>
                  <NameCell name={m.name} code={m.code} active={m.active} />
                  <Td className="whitespace-nowrap">NEMA {m.frameSize}</Td>
                  <Td className="text-right tabular-nums">
                    {formatNumber(m.holdingTorqueNm, 2, 3)}
                  </Td>
                  <Td className="text-right tabular-nums">{formatNumber(m.ratedCurrentA, 1, 2)}</Td>
                  <Td className="text-right tabular-nums">
                    {formatNumber(m.phaseResistanceOhm, 2, 3)}
                  </Td>
                  <Td className="text-right tabular-nums">
                    {formatNumber(m.phaseInductanceMh, 1, 3)}
                  </Td>
                  <Td>{m.insulationClass}</Td>
                  {isAdmin ? (
                    <Td>
                      <CatalogueRowActions kind="motor" id={m.id} code={m.code} active={m.active} />
                    </Td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </Table>
        )}
        <HelpList items={MOTOR_HELP} />
      </Panel>
    </div>
  );
}
