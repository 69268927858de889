using System.Diagnostics;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class RealPathTests : IDisposable
{
    private readonly TempTree _tree = new();

    public void Dispose() => _tree.Dispose();

    [Fact]
    public void Resolve_agrees_with_coreutils_realpath_through_chains_of_relative_and_absolute_links()
    {
        _tree.File("real/deep/p.png", SampleImages.Png());
        _tree.FolderLink("hop1", "real");
        _tree.FolderLink("x/hop2", Path.Combine("..", "hop1", "deep"));
        _tree.FolderLink("x/abs", _tree.PathOf("x"));
        string[] cases =
        [
            _tree.Root,
            _tree.PathOf("hop1"),
            _tree.PathOf("x/hop2"),
            _tree.PathOf("x/hop2/p.png"),
            _tree.PathOf("x/abs/hop2/../deep/p.png"),
            _tree.PathOf("x/abs/abs/abs/hop2"),
        ];

        foreach (var path in cases)
        {
            // GNU coreutils realpath -e is the reference: it resolves every link and fails on missing paths.
            Assert.Equal(CoreutilsRealPath(path), RealPath.Resolve(path));
        }
    }

    [Fact]
    public void Resolve_returns_null_for_a_missing_path_a_dangling_link_and_a_link_loop()
    {
        _tree.FileLink("dangling", "nowhere");
        _tree.FolderLink("l1", "l2");
        _tree.FolderLink("l2", "l1");

        Assert.Null(RealPath.Resolve(_tree.PathOf("missing/file")));
        Assert.Null(RealPath.Resolve(_tree.PathOf("dangling")));
        Assert.Null(RealPath.Resolve(_tree.PathOf("l1")));
        Assert.Null(CoreutilsRealPath(_tree.PathOf("l1")));
    }

    private static string? CoreutilsRealPath(string path)
    {
        var start = new ProcessStartInfo("realpath", ["-e", path]) { RedirectStandardOutput = true, RedirectStandardError = true };
        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEnd().TrimEnd('\n');
        process.WaitForExit();
        return process.ExitCode == 0 ? output : null;
    }
}
