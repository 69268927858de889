using System.Security.Cryptography;
using System.Text.Json;

namespace Lookup.Tests.Demo;

/// <summary>The committed demo folder is consistent: CSV, folders and truth.json agree, and the planted defects are really there.</summary>
public sealed class DemoCatalogueLayoutTests
{
    [Fact]
    public void Catalogue_csv_lists_exactly_the_photos_on_disk_with_their_folder_as_sku()
    {
        var lines = File.ReadAllLines(DemoFolder.PathOf("catalogue.csv"));
        Assert.Equal("file,sku", lines[0]);

        var rows = lines.Skip(1).Select(l => l.Split(',')).ToList();
        foreach (var row in rows)
        {
            Assert.Equal(2, row.Length);
            Assert.Equal($"photos/{row[1]}/", row[0][..(row[0].LastIndexOf('/') + 1)]);
        }

        var onDisk = Directory.EnumerateFiles(DemoFolder.PathOf("photos"), "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(DemoFolder.Root, f).Replace(Path.DirectorySeparatorChar, '/'))
            .Order(StringComparer.Ordinal);
        Assert.Equal(onDisk, rows.Select(r => r[0]).Order(StringComparer.Ordinal));
        Assert.InRange(rows.Select(r => r[1]).Distinct().Count(), 40, 60);
    }

    [Fact]
    public void Truth_file_names_existing_field_photos_and_some_parts_that_are_not_stocked()
    {
        using var truth = JsonDocument.Parse(File.ReadAllText(DemoFolder.PathOf("truth.json")));
        var skus = truth.RootElement.GetProperty("skus").EnumerateArray().Select(s => s.GetProperty("sku").GetString()).ToHashSet();
        var field = truth.RootElement.GetProperty("field").EnumerateArray().ToList();

        Assert.InRange(field.Count, 12, 23);
        foreach (var photo in field)
        {
            Assert.True(File.Exists(DemoFolder.PathOf(photo.GetProperty("file").GetString()!)));
            var sku = photo.GetProperty("sku");
            Assert.True(sku.ValueKind == JsonValueKind.Null || skus.Contains(sku.GetString()), $"unknown SKU {sku}");
        }

        Assert.InRange(field.Count(p => p.GetProperty("sku").ValueKind == JsonValueKind.Null), 2, 3);
    }

    [Fact]
    public void Planted_defects_are_really_in_the_catalogue()
    {
        using var truth = JsonDocument.Parse(File.ReadAllText(DemoFolder.PathOf("truth.json")));
        var defects = truth.RootElement.GetProperty("defects").EnumerateArray().ToList();
        var kinds = defects.Select(d => d.GetProperty("kind").GetString()).ToHashSet();
        Assert.Equal(["re-export-within-sku", "same-photo-two-skus", "wrong-part"], kinds.Order(StringComparer.Ordinal));

        foreach (var defect in defects)
        {
            var files = defect.GetProperty("files").EnumerateArray().Select(f => DemoFolder.PathOf(f.GetString()!)).ToList();
            var hashes = files.Select(f => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(f)))).ToList();
            switch (defect.GetProperty("kind").GetString())
            {
                case "same-photo-two-skus":
                    Assert.Equal(hashes[0], hashes[1]);
                    Assert.NotEqual(Path.GetDirectoryName(files[0]), Path.GetDirectoryName(files[1]));
                    break;
                case "re-export-within-sku":
                    Assert.NotEqual(hashes[0], hashes[1]);
                    Assert.Equal(Path.GetDirectoryName(files[0]), Path.GetDirectoryName(files[1]));
                    break;
                default:
                    Assert.NotEqual(defect.GetProperty("filedUnder")[0].GetString(), defect.GetProperty("actualSku")[0].GetString());
                    break;
            }
        }
    }
}
