using System.Diagnostics;
using Lookup.Tests.Imaging;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// Fills an <see cref="IngestTree"/> with the hostile corpus (<see cref="HostilePhotos"/>) under CORPUS/ and good
/// reference photos (tests/reference-data, see SOURCES.md) under their own SKU folders, and says what ingest must
/// make of each file: a failure reason, or null for a photo that must be indexed.
/// </summary>
internal static class HostileTree
{
    /// <summary>Good reference photos mixed into the run.</summary>
    public const int GoodPhotos = 8;

    /// <summary>
    /// The per-file decode limit the hostile runs use: no file may hold a worker longer than this. The largest
    /// good photo here decodes in well under 0.1 s on the 2-core development machine (see the imaging benchmark).
    /// </summary>
    public static readonly TimeSpan DecodeLimit = TimeSpan.FromSeconds(5);

    /// <summary>
    /// The name given to a photo whose file name is not valid UTF-8: "caf", byte 0xE9 (é in Latin-1), "-", byte
    /// 0xFF, ".jpg". .NET strings cannot hold such a name, so the file is made by the shell (printf octal escapes).
    /// </summary>
    public const string NonUtf8Bytes = @"caf\351-\377.jpg";

    /// <summary>A folder name that is not valid UTF-8 ("Teile-", byte 0xFF), holding one photo.</summary>
    public const string NonUtf8Folder = @"Teile-\377";

    /// <summary>Writes the tree; returns relative path → expected failure reason (null: must be indexed).</summary>
    public static Dictionary<string, string?> Fill(IngestTree tree, bool hostile = true)
    {
        var expected = new Dictionary<string, string?>(StringComparer.Ordinal);
        for (var i = 0; i < GoodPhotos; i++)
        {
            var reference = IngestTree.Distinct[i];
            var relative = $"GOOD-{i}/{i:00}{Path.GetExtension(reference)}";
            tree.Add(relative, reference);
            expected[relative] = null;
        }

        if (!hostile)
        {
            return expected;
        }

        foreach (var photo in HostilePhotos.All())
        {
            var relative = "CORPUS/" + photo.Name;
            tree.Write(relative, photo.Content);
            expected[relative] = photo.Reason;
        }

        return expected;
    }

    /// <summary>
    /// Copies a good photo to CORPUS/ under the non-UTF-8 name <see cref="NonUtf8Bytes"/>, and into a folder named
    /// <see cref="NonUtf8Folder"/>, with /bin/sh; returns the file name as .NET lists it (invalid bytes as U+FFFD).
    /// </summary>
    public static string AddNonUtf8Name(IngestTree tree)
    {
        var folder = Path.GetDirectoryName(tree.Write("CORPUS/.keep-folder", []))!;
        File.Delete(Path.Combine(folder, ".keep-folder"));
        var source = IngestTree.Reference(IngestTree.Distinct[GoodPhotos]);
        var script = $"cp \"$0\" \"$1/$(printf '{NonUtf8Bytes}')\" && mkdir \"$1/$(printf '{NonUtf8Folder}')\" && cp \"$0\" \"$1/$(printf '{NonUtf8Folder}')/a.jpg\"";
        var info = new ProcessStartInfo("/bin/sh") { ArgumentList = { "-c", script, source, folder } };
        using (var shell = Process.Start(info)!)
        {
            shell.WaitForExit();
            Assert.Equal(0, shell.ExitCode);
        }

        return Path.GetFileName(Assert.Single(Directory.GetFiles(folder, "caf*")));
    }

    /// <summary>Deletes what <see cref="AddNonUtf8Name"/> made (.NET cannot name it to delete it).</summary>
    public static void RemoveNonUtf8Name(IngestTree tree)
    {
        var folder = tree.PathOf("CORPUS");
        if (!OperatingSystem.IsLinux() || !Directory.Exists(folder))
        {
            return;
        }

        var info = new ProcessStartInfo("/bin/sh") { ArgumentList = { "-c", $"rm -rf \"$0/$(printf '{NonUtf8Bytes}')\" \"$0/$(printf '{NonUtf8Folder}')\"", folder } };
        using var shell = Process.Start(info)!;
        shell.WaitForExit();
    }
}
