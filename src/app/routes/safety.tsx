import { FlaskConical, Ruler, Wrench } from 'lucide-react';
import type { ReactNode } from 'react';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';

function Caution({ icon, title, children }: { icon: ReactNode; title: string; children: ReactNode }) {
  return (
    <Card className="flex flex-col gap-3 border-l-8 border-l-mark">
      <h2 className="flex items-center gap-3 text-2xl font-bold">
        {icon}
        {title}
      </h2>
      <ul className="flex max-w-prose list-disc flex-col gap-2 pl-6 text-lg">{children}</ul>
    </Card>
  );
}

/** `/safety`: the cautions of DESIGN.md section 6, in our own plain words. Open to everyone, signed in or not. */
export function SafetyRoute() {
  return (
    <div className="flex flex-col gap-6">
      <title>Safety notes · Loftbench</title>
      <PageHeader title="Safety notes" lead="Loftbench makes patterns. Cutting and gluing them is work that can hurt you. Read this before you start." />

      <Caution icon={<FlaskConical aria-hidden="true" className="size-7 text-caution" />} title="Epoxy and hardener">
        <li>
          Epoxy resin and its hardeners can sensitise your skin. Once you are sensitised it lasts: from then on even a small
          contact, or the fumes, can bring on a reaction.
        </li>
        <li>Wear gloves every time you mix, spread or clean up, and change them when they tear or get sticky.</li>
        <li>Wear eye protection. A splash in the eye needs rinsing with plenty of clean water straight away.</li>
        <li>Work with good ventilation, and wear a dust mask when sanding epoxy, above all before it has fully cured.</li>
        <li>Follow the maker's safety data sheet for the products you use.</li>
      </Caution>

      <Caution icon={<Wrench aria-hidden="true" className="size-7 text-caution" />} title="Saws, routers and sanders">
        <li>Keep the guards on and set right for the cut.</li>
        <li>
          Use a push stick whenever a hand would come within <span className="font-mono">150 mm</span> of the blade or cutter.
        </li>
        <li>Wear eye protection and hearing protection; wear a dust mask when cutting or sanding plywood.</li>
        <li>Unplug the machine before you change a blade or bit or clear a jam.</li>
        <li>When cutting a bevel, set the tilt on a scrap piece first and check it before cutting the frame.</li>
      </Caution>

      <Caution icon={<Ruler aria-hidden="true" className="size-7 text-caution" />} title="Frame sizes and structure">
        <li>
          Scantlings (frame sizes, frame spacing, plywood thickness, fastenings) come from the boat's designer and the rules that
          apply: ISO 12215 for small craft, or your local code.
        </li>
        <li>
          Loftbench draws what it is told. It does not check the strength of a boat and does not certify structure.
        </li>
        <li>Before cutting good stock, check a pattern against the plans or the hull, and check the scale of every print.</li>
      </Caution>
    </div>
  );
}
