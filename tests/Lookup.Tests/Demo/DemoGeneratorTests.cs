using Lookup.DemoGenerator.Catalogue;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Demo;

/// <summary>
/// The demo generator is deterministic, and the committed demo-catalogue is what it produces for seed 2026.
/// Shots are rendered small here except where a committed file is compared, to keep the suite fast.
/// </summary>
public sealed class DemoGeneratorTests
{
    private const string StudioFile = "photos/HN-M8-ZN/HN-M8-ZN_1.jpg";

    [Theory]
    [InlineData("photos/HB-M8x40-ZN/HB-M8x40-ZN_1.jpg")]
    [InlineData("photos/SG-24T-BR/SG-24T-BR_2.jpg")]
    [InlineData("field/bench-05.jpg")]
    public void Rendering_the_same_shot_twice_gives_identical_pixels_and_jpeg_bytes(string file)
    {
        var shot = SmallShot(CataloguePlan.Create(DemoFolder.Seed), file);

        var first = Pixels(shot);
        var second = Pixels(shot);

        Assert.Equal(first, second);
        Assert.Equal(PhotoMaker.Render(new RenderRecipe(shot, 90)), PhotoMaker.Render(new RenderRecipe(shot, 90)));
    }

    [Fact]
    public void A_different_seed_gives_a_different_photo_of_the_same_file()
    {
        var a = Pixels(SmallShot(CataloguePlan.Create(DemoFolder.Seed), StudioFile));
        var b = Pixels(SmallShot(CataloguePlan.Create(DemoFolder.Seed + 1), StudioFile));

        int changed = a.Zip(b).Count(pair => !pair.First.Equals(pair.Second));
        Assert.True(changed > a.Length / 20, $"only {changed} of {a.Length} pixels changed with the seed");
    }

    [Fact]
    public void A_rendered_shot_is_a_part_on_a_plain_background_not_an_empty_frame()
    {
        var pixels = Pixels(SmallShot(CataloguePlan.Create(DemoFolder.Seed), StudioFile));

        var corner = pixels[0];
        int differing = pixels.Count(p => Math.Abs(p.R - corner.R) + Math.Abs(p.G - corner.G) + Math.Abs(p.B - corner.B) > 40);
        Assert.InRange(differing, pixels.Length / 10, pixels.Length * 9 / 10);
    }

    [Theory]
    [InlineData(StudioFile)]
    [InlineData("photos/AB-40-ZN/AB-40-ZN_4.jpg")]
    [InlineData("field/bench-02.jpg")]
    public void Committed_demo_file_equals_what_the_generator_renders_for_its_seed(string file)
    {
        var planned = CataloguePlan.Create(DemoFolder.Seed).Get(file);
        var recipe = Assert.IsType<RenderRecipe>(planned.Recipe);

        byte[] fresh = PhotoMaker.Render(recipe);
        byte[] committed = File.ReadAllBytes(DemoFolder.PathOf(file));

        // ImageSharp 2.1's JPEG encoder is deterministic on one machine kind; a mismatch means the committed
        // demo is stale: regenerate it with the command in demo-catalogue/README.md.
        Assert.True(fresh.AsSpan().SequenceEqual(committed), $"{file}: rendered {fresh.Length} bytes differ from the committed {committed.Length} bytes");
    }

    private static ShotSpec SmallShot(CataloguePlan plan, string file)
    {
        var recipe = Assert.IsType<RenderRecipe>(plan.Get(file).Recipe);
        return recipe.Shot with { Width = 96, Height = 72 };
    }

    private static Rgb24[] Pixels(ShotSpec shot)
    {
        using var image = ShotRenderer.Render(shot);
        var pixels = new Rgb24[image.Width * image.Height];
        image.CopyPixelDataTo(pixels);
        return pixels;
    }
}
