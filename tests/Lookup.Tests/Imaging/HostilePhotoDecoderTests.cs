using Lookup.Imaging;

namespace Lookup.Tests.Imaging;

/// <summary>
/// Each file of the hostile corpus (<see cref="HostilePhotos"/>) through the decoder alone, with the default limits:
/// refused with its reason and a message naming it, or decoded when it is a genuine photo. Nothing else may escape.
/// </summary>
public sealed class HostilePhotoDecoderTests
{
    public static TheoryData<string> Names => [.. HostilePhotos.All().Select(p => p.Name)];

    [Theory]
    [MemberData(nameof(Names))]
    public void Decode_refuses_each_bad_file_with_its_reason_and_decodes_each_genuine_one(string name)
    {
        var photo = HostilePhotos.All().Single(p => p.Name == name);
        var path = "/catalogue/CORPUS/" + name;

        if (photo.Reason is null)
        {
            using var decoded = new PhotoDecoder().Decode(photo.Content, path);
            Assert.True(decoded.Image.Width * decoded.Image.Height > 0, photo.ToString());
            return;
        }

        if (photo.Content.Length == 0)
        {
            // The scanner flags empty files before the decoder sees them; the decoder refuses them the same way.
            Assert.Equal(PhotoRejectionReason.EmptyFile, Assert.Throws<PhotoRejectedException>(() => new PhotoDecoder().Decode(photo.Content, path)).Reason);
            return;
        }

        var rejection = Assert.Throws<PhotoRejectedException>(() => new PhotoDecoder().Decode(photo.Content, path).Dispose());
        Assert.Equal(photo.Reason, rejection.Reason.ToString());
        Assert.StartsWith(path + ": ", rejection.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_corpus_holds_at_least_30_bad_files_covering_every_format_and_reason()
    {
        var bad = HostilePhotos.All().Where(p => p.Reason is not null).ToList();

        Assert.True(bad.Count >= 30, $"{bad.Count} bad files");
        Assert.Equal(
            ["Corrupt", "EmptyFile", "TooManyFrames", "TooManyPixels", "UnknownFormat"],
            bad.Select(p => p.Reason!).Distinct().Order(StringComparer.Ordinal));
        foreach (var extension in new[] { ".jpg", ".png", ".gif", ".webp", ".tif" })
        {
            Assert.Contains(bad, p => p.Name.StartsWith("cut-", StringComparison.Ordinal) && p.Name.EndsWith(extension, StringComparison.Ordinal));
            Assert.Contains(bad, p => p.Name.StartsWith("bomb-", StringComparison.Ordinal) && p.Name.EndsWith(extension, StringComparison.Ordinal));
        }
    }
}
