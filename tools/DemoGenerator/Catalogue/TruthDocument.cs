using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using Lookup.DemoGenerator.Parts;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// Writes truth.json: what every file really shows, the planted defects and the look-alike groups, for tests
/// and demos to check answers against. Field names are part of the demo's contract (see DEVELOPERS.md).
/// </summary>
internal static class TruthDocument
{
    public static string Compose(CataloguePlan plan, string command)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteString("supplier", $"{SupplierRange.Supplier}, {SupplierRange.Town} (invented)");
            w.WriteNumber("seed", plan.Seed);
            w.WriteString("command", command);
            w.WriteString("catalogue", "catalogue.csv");
            WriteSkus(w, plan);
            WriteField(w, plan);
            WriteDefects(w, plan);
            w.WriteStartArray("lookAlikeGroups");
            foreach (var group in SupplierRange.LookAlikes)
            {
                w.WriteStartObject();
                w.WriteString("reason", group.Reason);
                WriteStrings(w, "skus", group.Skus);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }

    private static void WriteSkus(Utf8JsonWriter w, CataloguePlan plan)
    {
        w.WriteStartArray("skus");
        foreach (var sku in SupplierRange.Skus)
        {
            w.WriteStartObject();
            w.WriteString("sku", sku.Code);
            w.WriteString("description", sku.Description);
            w.WriteString("finish", FinishInfo.Name(sku.Finish));
            WriteStrings(w, "files", plan.Photos.Where(p => p.FiledUnder == sku.Code).Select(p => p.File).Order(StringComparer.Ordinal));
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void WriteField(Utf8JsonWriter w, CataloguePlan plan)
    {
        w.WriteStartArray("field");
        foreach (var photo in plan.Field)
        {
            w.WriteStartObject();
            w.WriteString("file", photo.File);
            if (photo.ShowsSku is null)
            {
                w.WriteNull("sku");
            }
            else
            {
                w.WriteString("sku", photo.ShowsSku);
            }

            w.WriteString("description", photo.Note);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void WriteDefects(Utf8JsonWriter w, CataloguePlan plan)
    {
        w.WriteStartArray("defects");
        foreach (var defect in plan.Defects)
        {
            w.WriteStartObject();
            w.WriteString("kind", defect.Kind);
            WriteStrings(w, "files", defect.Files);
            WriteStrings(w, "filedUnder", defect.FiledUnder);
            WriteStrings(w, "actualSku", defect.ActualSku);
            w.WriteString("note", defect.Note);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void WriteStrings(Utf8JsonWriter w, string name, IEnumerable<string> values)
    {
        w.WriteStartArray(name);
        foreach (string v in values)
        {
            w.WriteStringValue(v);
        }

        w.WriteEndArray();
    }
}
