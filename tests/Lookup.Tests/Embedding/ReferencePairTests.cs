using Lookup.Tests.Imaging;

namespace Lookup.Tests.Embedding;

/// <summary>
/// External check on the opencv-doc sample photos (Debian opencv-doc, examples/data; see tests/reference-data/SOURCES.md):
/// pairs showing the same scene under a change of viewpoint, light, time or edit. Among all of the folder's committed
/// images, each pair photo's nearest neighbour by exact cosine search must be its partner.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class ReferencePairTests(EmbedderFixture fixture)
{
    public static TheoryData<string, string> Pairs() => new()
    {
        { "graf1.png", "graf3.png" }, // Oxford affine benchmark, Graffiti viewpoint change (Mikolajczyk et al. 2005)
        { "leuvenA.jpg", "leuvenB.jpg" }, // Oxford affine benchmark, Leuven illumination change (Mikolajczyk et al. 2005)
        { "aero1.jpg", "aero3.jpg" }, // aerial photos of one area
        { "aloeL.jpg", "aloeR.jpg" }, // Middlebury stereo pair
        { "left.jpg", "right.jpg" }, // stereo pair
        { "Blender_Suzanne1.jpg", "Blender_Suzanne2.jpg" }, // two renderings of one model
        { "basketball1.png", "basketball2.png" }, // Middlebury optical-flow frames
        { "rubberwhale1.png", "rubberwhale2.png" }, // Middlebury optical-flow frames
        { "ela_original.jpg", "ela_modified.jpg" }, // a photo and an edited copy
        { "imageTextN.png", "imageTextR.png" }, // a page of text, upright and rotated
    };

    [Theory]
    [MemberData(nameof(Pairs))]
    public void Nearest_neighbour_of_each_pair_photo_among_all_opencv_samples_is_its_partner(string first, string second)
    {
        var gallery = ReferenceData.OpenCvGallery().ToDictionary(path => Path.GetFileName(path), fixture.EmbedFile);
        Assert.Equal(57, gallery.Count);

        foreach (var (query, partner) in new[] { (first, second), (second, first) })
        {
            var ranking = ExactSearch.Ranking(gallery[query], gallery, exclude: query);
            Assert.True(ranking[0].Name == partner, $"{query}: expected {partner} first; nearest were {ExactSearch.Describe(ranking)}");
        }
    }
}
