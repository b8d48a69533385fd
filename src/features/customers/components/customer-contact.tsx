import type { ReactNode } from "react";
import { Mail, MapPin, Phone } from "lucide-react";
import type { CustomerDto } from "@shared/schemas/customer.schema";
import { formatDateTime } from "@/utils/format-date";

function Line({ icon, term, children }: { icon: ReactNode; term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5">
      <dt className="flex items-center gap-2 text-xs font-semibold tracking-wide text-primer-700 uppercase">
        <span aria-hidden className="text-primer-600 [&_svg]:size-4">
          {icon}
        </span>
        {term}
      </dt>
      <dd className="pl-6 text-ink-950">{children}</dd>
    </div>
  );
}

const none = <span className="text-primer-600">Not given</span>;

export function CustomerContact({ customer }: { customer: CustomerDto }) {
  return (
    <div className="flex flex-col gap-5">
      <dl className="flex flex-col gap-4">
        <Line icon={<Mail />} term="Email">
          {customer.email ? (
            <a href={`mailto:${customer.email}`} className="font-medium text-candy-700 underline-offset-2 hover:underline">
              {customer.email}
            </a>
          ) : (
            none
          )}
        </Line>
        <Line icon={<Phone />} term="Phone">
          {customer.phone ? (
            <a href={`tel:${customer.phone}`} className="font-medium text-candy-700 underline-offset-2 hover:underline">
              {customer.phone}
            </a>
          ) : (
            none
          )}
        </Line>
        <Line icon={<MapPin />} term="Address">
          {customer.address ? <span className="whitespace-pre-line">{customer.address}</span> : none}
        </Line>
      </dl>
      <div>
        <h3 className="text-xs font-semibold tracking-wide text-primer-700 uppercase">Notes</h3>
        <p className="mt-1 whitespace-pre-line text-ink-950">{customer.notes ?? <span className="text-primer-600">No notes</span>}</p>
      </div>
      <p className="text-xs text-primer-700">Customer since {formatDateTime(customer.createdAt)}</p>
    </div>
  );
}
