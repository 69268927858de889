using System.CommandLine;
using Lookup.Cli;
using Lookup.Tests.Imaging;
using Lookup.Tests.Matching;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Cli;

/// <summary>
/// One index ingested once, by the real <c>lookup ingest</c>, from reference photos filed one per SKU (see
/// <see cref="ReferenceCatalogue"/>): the first photo of each opencv-doc pair, the skimage originals, six opencv-doc
/// distractors, and a drawn checkerboard filed under a SKU that starts like a spreadsheet formula. Shared by the
/// match command test classes.
/// </summary>
public sealed class MatchIndexFixture : IDisposable
{
    /// <summary>The SKU of the drawn checkerboard: a CSV cell starting with '=' must be neutralised.</summary>
    public const string FormulaSku = "=SUM(A1)";

    public MatchIndexFixture()
    {
        Root = Path.Combine(Path.GetTempPath(), "lookup-match-" + Guid.NewGuid().ToString("N"));
        Catalogue = Path.Combine(Root, "catalogue");
        Queries = Path.Combine(Root, "queries");
        Index = Path.Combine(Root, "ref.lookup");
        Directory.CreateDirectory(Queries);
        ReferenceCatalogue.Write(Catalogue, Filed);
        Directory.CreateDirectory(Path.Combine(Catalogue, FormulaSku));
        Checkerboard(Path.Combine(Catalogue, FormulaSku, "checkerboard.png"));

        var (exitCode, output, error) = Run("ingest", Catalogue, "--index", Index, "--quiet");
        if (exitCode != 0)
        {
            throw new InvalidOperationException($"ingest exited {exitCode}: {output} {error}");
        }
    }

    /// <summary>The reference photos in the index, one SKU each.</summary>
    public static IReadOnlyList<string> Filed { get; } =
    [
        .. ReferenceCatalogue.OpenCv(ReferenceCatalogue.Pairs.Select(p => p.Filed)),
        .. ReferenceCatalogue.SkImageOriginals.Select(ReferenceData.SkImage),
        .. ReferenceCatalogue.OpenCv(ReferenceCatalogue.Others().Filed.Take(6)),
    ];

    public string Root { get; }

    public string Catalogue { get; }

    public string Queries { get; }

    public string Index { get; }

    /// <summary>Writes <paramref name="bytes"/> to a query file and returns its path.</summary>
    public string Query(string name, byte[] bytes)
    {
        var path = Path.Combine(Queries, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    /// <summary>Runs one lookup command line in process with its output captured.</summary>
    public static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // Left for the system's temp cleaning.
        }
    }

    private static void Checkerboard(string path)
    {
        using var image = new Image<Rgb24>(256, 256);
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < rows.Height; y++)
            {
                var row = rows.GetRowSpan(y);
                for (int x = 0; x < row.Length; x++)
                {
                    row[x] = ((x / 32) + (y / 32)) % 2 == 0 ? new Rgb24(200, 30, 30) : new Rgb24(240, 240, 240);
                }
            }
        });
        image.SaveAsPng(path);
    }
}
