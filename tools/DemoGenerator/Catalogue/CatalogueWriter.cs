using System.Diagnostics;
using System.Text;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Makes every planned file and writes the demo folder: photos, field photos, CSV, truth file and README.</summary>
internal static class CatalogueWriter
{
    public static void Write(CataloguePlan plan, string outputFolder, string command, TextWriter log)
    {
        // Clear the previous run so renamed or dropped files do not linger, but only in a folder this tool made.
        bool ours = File.Exists(Path.Combine(outputFolder, "truth.json"));
        foreach (string sub in new[] { "photos", "field" })
        {
            string path = Path.Combine(outputFolder, sub);
            if (!Directory.Exists(path))
            {
                continue;
            }

            if (!ours)
            {
                throw new IOException($"{path} exists but {outputFolder} has no truth.json from an earlier run: choose an empty --out folder.");
            }

            Directory.Delete(path, recursive: true);
        }

        var made = new Dictionary<string, byte[]>(StringComparer.Ordinal);
        var clock = Stopwatch.StartNew();
        var ordered = plan.All.OrderBy(p => p.Recipe is RenderRecipe ? 0 : 1).ToList();
        foreach (var photo in ordered)
        {
            byte[] bytes = PhotoMaker.Make(photo, made);
            made[photo.File] = bytes;
            string target = Path.Combine(outputFolder, photo.File);
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.WriteAllBytes(target, bytes);
            log.WriteLine($"{made.Count,3}/{ordered.Count} {photo.File} ({bytes.Length / 1024} KiB, {clock.Elapsed.TotalSeconds:0.0} s)");
        }

        var csv = new StringBuilder("file,sku\n");
        foreach (var photo in plan.Photos.OrderBy(p => p.File, StringComparer.Ordinal))
        {
            csv.Append(photo.File).Append(',').Append(photo.FiledUnder).Append('\n');
        }

        File.WriteAllText(Path.Combine(outputFolder, "catalogue.csv"), csv.ToString());
        File.WriteAllText(Path.Combine(outputFolder, "truth.json"), TruthDocument.Compose(plan, command));
        File.WriteAllText(Path.Combine(outputFolder, "README.md"), ReadmeText.Compose(plan, command));
        log.WriteLine($"wrote {made.Count} photos to {outputFolder} in {clock.Elapsed.TotalSeconds:0.0} s");
    }
}
