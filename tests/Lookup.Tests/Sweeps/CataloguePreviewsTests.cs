using System.Security.Cryptography;
using Lookup.Imaging;
using Lookup.Sweeps;
using SixLabors.ImageSharp;

namespace Lookup.Tests.Sweeps;

/// <summary>Report previews made from the catalogue's files (<see cref="CataloguePreviews"/>), on a reference photo.</summary>
public sealed class CataloguePreviewsTests : IDisposable
{
    private readonly string _outer = Directory.CreateTempSubdirectory("lookup-previews-").FullName;
    private readonly PhotoDecoder _decoder = new();
    private readonly string _root;
    private readonly string _sha;

    public CataloguePreviewsTests()
    {
        // skimage/rocket.jpg (python3-skimage), 640 × 427.
        // The same photo also lies just outside the catalogue root, where no preview may reach.
        var bytes = File.ReadAllBytes(ReferencePhotos.PathOf("skimage/rocket.jpg"));
        _root = Path.Combine(_outer, "catalogue");
        Directory.CreateDirectory(Path.Combine(_root, "R-1"));
        File.WriteAllBytes(Path.Combine(_root, "R-1", "rocket.jpg"), bytes);
        File.WriteAllBytes(Path.Combine(_outer, "rocket.jpg"), bytes);
        _sha = Convert.ToHexStringLower(SHA256.HashData(bytes));
    }

    [Fact]
    public void Make_shrinks_the_photo_to_fit_the_side_keeping_its_shape()
    {
        var jpeg = CataloguePreviews.Make(_root, "R-1/rocket.jpg", _sha.ToUpperInvariant(), 160, _decoder);

        using var preview = Image.Load(jpeg!);
        Assert.Equal((160, 107), (preview.Width, preview.Height));
        Assert.True(jpeg!.Length < 20_000, $"{jpeg.Length} bytes");
    }

    [Theory]
    [InlineData("R-1/missing.jpg")]
    [InlineData("../rocket.jpg")]
    [InlineData("R-1/../../rocket.jpg")]
    public void Make_gives_no_preview_for_a_missing_file_or_one_outside_the_root(string path)
    {
        Assert.Null(CataloguePreviews.Make(_root, path, _sha, 160, _decoder));
    }

    [Fact]
    public void Make_gives_no_preview_for_a_file_changed_since_it_was_indexed()
    {
        Assert.Null(CataloguePreviews.Make(_root, "R-1/rocket.jpg", new string('0', 64), 160, _decoder));
    }

    [Fact]
    public void Prepare_without_a_catalogue_root_gives_no_previews()
    {
        var member = new FindingMember(1, "R-1", "R-1/rocket.jpg", _sha, 640, 427, 1);
        var finding = new SweepFinding(FindingKind.CopiesInOneSku, "k", [member], [], "");

        Assert.Null(CataloguePreviews.Prepare(null, [finding])(member));
        Assert.NotNull(CataloguePreviews.Prepare(_root, [finding])(member));
    }

    public void Dispose() => Directory.Delete(_outer, recursive: true);
}
