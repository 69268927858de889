using Lookup.Imaging;

namespace Lookup.Tests.Imaging;

public sealed class PhotoRejectionCodesTests
{
    [Theory]
    [InlineData(PhotoRejectionReason.EmptyFile, "empty-file")]
    [InlineData(PhotoRejectionReason.UnknownFormat, "unknown-format")]
    [InlineData(PhotoRejectionReason.Corrupt, "corrupt")]
    [InlineData(PhotoRejectionReason.TooManyPixels, "too-many-pixels")]
    [InlineData(PhotoRejectionReason.FileTooLarge, "file-too-large")]
    [InlineData(PhotoRejectionReason.TooManyFrames, "too-many-frames")]
    [InlineData(PhotoRejectionReason.Unsupported, "unsupported")]
    [InlineData(PhotoRejectionReason.Unreadable, "unreadable")]
    [InlineData(PhotoRejectionReason.TimedOut, "timed-out")]
    public void Code_is_the_kebab_case_name_scripts_read(PhotoRejectionReason reason, string expected) =>
        Assert.Equal(expected, reason.Code());

    [Fact]
    public void Code_gives_every_reason_its_own_name() =>
        Assert.Equal(Enum.GetValues<PhotoRejectionReason>().Length, Enum.GetValues<PhotoRejectionReason>().Select(r => r.Code()).Distinct().Count());
}
