import { Card } from "../../components/ui/card";
import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { CatalogueImportForm } from "../../features/inks/components/catalogue-import-form";

const columns: { name: string; meaning: string; example: string }[] = [
  { name: "brand", meaning: "The maker's name. A brand not yet in the catalogue is created.", example: "Meadowgate Inks" },
  { name: "name", meaning: "The ink's name as printed on the pad.", example: "Harbour Fog" },
  { name: "type", meaning: "dye, pigment or hybrid", example: "dye" },
  { name: "hex", meaning: "Screen colour, #rrggbb. Leave empty when l, a, b are given.", example: "#6f8fa3" },
  { name: "l", meaning: "CIELAB L* (D65), 0 to 100. Leave l, a, b empty when hex is given.", example: "57.9" },
  { name: "a", meaning: "CIELAB a*, −128 to 128", example: "-6.1" },
  { name: "b", meaning: "CIELAB b*, −128 to 128", example: "-14.8" },
  { name: "discontinued", meaning: "true or false (empty means false)", example: "false" },
];

const exampleCsv = `brand,name,type,hex,l,a,b,discontinued
Meadowgate Inks,Harbour Fog,dye,#6f8fa3,,,,false
Meadowgate Inks,Marigold Field,pigment,,78.4,12.9,71.2,false
Old Mill Colour,Bramble Jam,hybrid,#5e2748,,,,true`;

export default function InkImportPage() {
  return (
    <>
      <PageHeader
        documentTitle="Import catalogue"
        eyebrow="Ink catalogue"
        title="Import the catalogue"
        intro="Add or update many inks at once from a CSV file. An ink with the same brand and name is updated, not duplicated."
      />
      <RequireRole role="admin">
        {() => (
          <div className="grid grid-cols-1 gap-8 lg:grid-cols-2 [&>*]:min-w-0">
            <Card className="self-start">
              <h2 className="mb-4 text-xl font-bold">Upload</h2>
              <CatalogueImportForm />
            </Card>
            <section aria-labelledby="csv-layout" className="space-y-4">
              <h2 id="csv-layout" className="text-xl font-bold">
                The file's layout
              </h2>
              <p className="text-ink-soft">
                Comma-separated, UTF-8, with this header row first. Each ink needs its colour as <strong>hex</strong>{" "}
                or as <strong>l, a, b</strong>. Problems are reported by line number, counting the header as line 1.
              </p>
              <div className="overflow-x-auto rounded-lg border border-rule bg-card" tabIndex={0} role="region" aria-label="Columns">
                <table className="w-full text-left text-sm">
                  <caption className="sr-only">Catalogue CSV columns, in order</caption>
                  <thead className="bg-paper-shade text-ink-soft">
                    <tr>
                      <th scope="col" className="px-3 py-2">
                        Column
                      </th>
                      <th scope="col" className="px-3 py-2">
                        What goes in it
                      </th>
                      <th scope="col" className="px-3 py-2">
                        Example
                      </th>
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-rule">
                    {columns.map((c) => (
                      <tr key={c.name}>
                        <th scope="row" className="px-3 py-2 font-bold whitespace-nowrap">
                          {c.name}
                        </th>
                        <td className="px-3 py-2 text-ink-soft">{c.meaning}</td>
                        <td className="px-3 py-2 whitespace-nowrap tabular-nums">{c.example}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              <div>
                <h3 className="mb-2 font-bold">Example file</h3>
                <pre
                  tabIndex={0}
                  aria-label="Example CSV"
                  className="overflow-x-auto rounded-lg border border-rule bg-ink p-4 text-sm leading-relaxed text-card"
                >
                  {exampleCsv}
                </pre>
              </div>
            </section>
          </div>
        )}
      </RequireRole>
    </>
  );
}
