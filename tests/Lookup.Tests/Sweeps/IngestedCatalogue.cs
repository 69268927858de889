using System.CommandLine;
using Lookup.Cli;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// A photo tree of real photos with planted copies, ingested once by the real <c>lookup ingest</c> command and shared
/// by the sweep command tests (collection <see cref="IngestedCatalogueCollection"/>).
/// The tree: each reference photo of <see cref="ReferencePhotos.Sources"/> (tests/reference-data, see SOURCES.md)
/// under its own SKU folder <c>S{n}</c> with the seven planted edits of <see cref="PlantedEdits"/> beside it (the byte
/// copy of every second source under another SKU, <c>S{n}-other</c>); the second views of
/// <see cref="ReferencePhotos.SecondViews"/> as pairs under <c>V{n}</c>; and one byte copy of graf3 under a SKU folder
/// and file name made to break careless output (<see cref="HostileSku"/>, <see cref="HostileName"/>).
/// Ground truth: two photos are the same photo exactly when they come from the same source file.
/// Tests that change the index or the tree work on a <see cref="CopyWorkspace"/>.
/// </summary>
public sealed class IngestedCatalogue : IDisposable
{
    /// <summary>A SKU folder name with markup, quotes, an ampersand and non-ASCII letters (test data only).</summary>
    public const string HostileSku = "<img src=x onerror=alert(2)> & \"SKU\" 'Ø12'";

    /// <summary>A file name with a script tag, quotes and non-ASCII letters (a slash cannot occur in a file name).</summary>
    public const string HostileName = "<script>alert('x')<script> \"quoted\" Ölfilter Ø12 日本.png";

    private readonly Dictionary<string, int> _sourceOf = new(StringComparer.Ordinal);
    private readonly Dictionary<string, (string Edit, PairRelation Relation, CopyEdits Edits, string Original)> _plants = new(StringComparer.Ordinal);

    public IngestedCatalogue()
    {
        Root = Path.Combine(Path.GetTempPath(), "lookup-sweep-tests-" + Guid.NewGuid().ToString("N"));
        Tree = Path.Combine(Root, "catalogue");
        Index = Path.Combine(Root, "parts.lookup");
        Build();
        var (exitCode, output, error) = RunCommand("ingest", Tree, "--index", Index, "--quiet");
        if (exitCode != 0)
        {
            throw new InvalidOperationException($"The fixture's ingest exited with {exitCode}:\n{output}\n{error}");
        }
    }

    /// <summary>Temporary folder holding tree and index.</summary>
    public string Root { get; }

    /// <summary>The catalogue root.</summary>
    public string Tree { get; }

    /// <summary>The ingested index (never changed by tests: use <see cref="CopyWorkspace"/>).</summary>
    public string Index { get; }

    /// <summary>Source number of each photo, by path relative to the root (second views count as sources of their own).</summary>
    public IReadOnlyDictionary<string, int> SourceOf => _sourceOf;

    /// <summary>Each planted copy: the edit, what the sweep must call it, and its original's path.</summary>
    public IReadOnlyDictionary<string, (string Edit, PairRelation Relation, CopyEdits Edits, string Original)> Plants => _plants;

    /// <summary>Relative path of the hostile byte copy of graf3.</summary>
    public string HostilePath => $"{HostileSku}/{HostileName}";

    /// <summary>Relative path of graf3 itself.</summary>
    public string Graf3Path => "V0/graf3.png";

    /// <summary>Runs one <c>lookup</c> command line in process.</summary>
    public static (int ExitCode, string Output, string Error) RunCommand(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }

    /// <summary>A private copy of tree and index (file times kept, so a re-ingest sees nothing changed).</summary>
    public Workspace CopyWorkspace()
    {
        var workspace = new Workspace(Path.Combine(Path.GetTempPath(), "lookup-sweep-tests-" + Guid.NewGuid().ToString("N")));
        foreach (var file in Directory.EnumerateFiles(Tree, "*", SearchOption.AllDirectories))
        {
            var copy = Path.Combine(workspace.Tree, Path.GetRelativePath(Tree, file));
            Directory.CreateDirectory(Path.GetDirectoryName(copy)!);
            File.Copy(file, copy);
            File.SetLastWriteTimeUtc(copy, File.GetLastWriteTimeUtc(file));
        }

        File.Copy(Index, workspace.Index);
        var journal = IndexFile.JournalPathFor(Index);
        if (File.Exists(journal))
        {
            File.Copy(journal, IndexFile.JournalPathFor(workspace.Index));
        }

        return workspace;
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

    private void Build()
    {
        var decoder = new PhotoDecoder();
        for (var s = 0; s < ReferencePhotos.Sources.Length; s++)
        {
            var source = ReferencePhotos.Sources[s];
            var bytes = File.ReadAllBytes(ReferencePhotos.PathOf(source));
            var name = Path.GetFileName(source);
            var original = Write($"S{s}/{name}", bytes, s);
            using var decoded = decoder.Decode(bytes, source);
            foreach (var (edit, relation, edits) in PlantedEdits.All)
            {
                var path = edit == "byte copy"
                    ? s % 2 == 1 ? $"S{s}-other/{name}" : $"S{s}/{Path.GetFileNameWithoutExtension(name)} (byte copy){Path.GetExtension(name)}"
                    : $"S{s}/{Path.GetFileNameWithoutExtension(name)} ({edit}).jpg";
                Write(path, PlantedEdits.Apply(edit, decoded.Image, bytes), s);
                _plants[path] = (edit, relation, edits, original);
            }
        }

        for (var v = 0; v < ReferencePhotos.SecondViews.Length; v++)
        {
            var (first, second) = ReferencePhotos.SecondViews[v];
            Write($"V{v}/{Path.GetFileName(first)}", File.ReadAllBytes(ReferencePhotos.PathOf(first)), 100 + (2 * v));
            Write($"V{v}/{Path.GetFileName(second)}", File.ReadAllBytes(ReferencePhotos.PathOf(second)), 101 + (2 * v));
        }

        Write(HostilePath, File.ReadAllBytes(Path.Combine(Tree, Graf3Path)), _sourceOf[Graf3Path]);
        _plants[HostilePath] = ("byte copy", PairRelation.IdenticalBytes, CopyEdits.None, Graf3Path);
    }

    private string Write(string relative, byte[] bytes, int source)
    {
        var path = Path.Combine(Tree, relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllBytes(path, bytes);
        _sourceOf[relative] = source;
        return relative;
    }

    /// <summary>A private tree and index copy, deleted on dispose.</summary>
    public sealed class Workspace(string root) : IDisposable
    {
        public string Root { get; } = Directory.CreateDirectory(root).FullName;

        public string Tree => Path.Combine(Root, "catalogue");

        public string Index => Path.Combine(Root, "parts.lookup");

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
    }
}
