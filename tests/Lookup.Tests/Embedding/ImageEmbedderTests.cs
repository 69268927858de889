using System.Numerics.Tensors;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Tests.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Embedding;

[Collection(EmbedderCollection.Name)]
public sealed class ImageEmbedderTests(EmbedderFixture fixture)
{
    [Fact]
    public void Load_of_the_default_card_gives_512_wide_embeddings_from_224_pixel_input()
    {
        Assert.Equal(512, fixture.Embedder.Dimension);
        Assert.Equal(224, fixture.Embedder.InputSize);
        Assert.Equal(3 * 224 * 224, fixture.Embedder.TensorLength);
        Assert.True(fixture.Embedder.Normalisation.HasMeanImage);
        Assert.Equal(ChannelOrder.Bgr, fixture.Embedder.Normalisation.ChannelOrder);
    }

    [Fact]
    public void Embed_returns_a_unit_vector_and_the_norm_before_normalising()
    {
        var embedding = new float[512];

        var result = fixture.Photos.Embed(ReferenceData.SkImage("rocket.jpg"), embedding);

        Assert.InRange(TensorPrimitives.Norm(embedding), 0.99999f, 1.00001f);
        Assert.True(result.Norm > 1, $"norm {result.Norm}");
        Assert.All(embedding, v => Assert.True(v >= 0, "pooled ReLU features are never negative"));
        Assert.Equal(new PhotoInfo(PhotoFormat.Jpeg, 640, 427, 112525, 1, 1), result.Info);
    }

    [Fact]
    public void Embed_of_a_tensor_equals_embed_of_the_image_it_was_written_from()
    {
        using var photo = fixture.Decoder.Decode(ReferenceData.SkImage("coffee.png"));
        var tensor = new float[fixture.Embedder.TensorLength];
        TensorWriter.WriteTensor(photo.Image, fixture.Embedder.Normalisation, tensor);
        var fromTensor = new float[512];
        var fromImage = new float[512];

        var normFromTensor = fixture.Embedder.Embed(tensor, fromTensor);
        var normFromImage = fixture.Embedder.Embed(photo.Image, fromImage);

        Assert.Equal(fromImage, fromTensor);
        Assert.Equal(normFromImage, normFromTensor);
    }

    [Fact]
    public void Embed_of_a_region_of_a_decoded_photo_equals_embed_of_the_cropped_image()
    {
        using var photo = fixture.Decoder.Decode(ReferenceData.SkImage("motorcycle_left.png"));
        var region = new Rectangle(0, 0, photo.Image.Width / 3, photo.Image.Height);
        using var cropped = photo.Image.Clone(x => x.Crop(region));
        var ofRegion = new float[512];
        fixture.Photos.Embed(photo, region, ofRegion);

        Assert.Equal(fixture.EmbedImage(cropped), ofRegion);
    }

    [Fact]
    public void Embed_from_several_threads_at_once_gives_the_same_vectors_as_one_thread()
    {
        string[] files = ["astronaut.png", "coffee.png", "chelsea.png", "rocket.jpg"];
        var images = files.Select(f => fixture.Decoder.Decode(ReferenceData.SkImage(f))).ToArray();
        try
        {
            var sequential = images.Select(p => fixture.EmbedImage(p.Image)).ToArray();
            var concurrent = new float[4 * images.Length][];

            Parallel.For(0, concurrent.Length, new ParallelOptions { MaxDegreeOfParallelism = 4 }, i =>
                concurrent[i] = fixture.EmbedImage(images[i % images.Length].Image));

            for (var i = 0; i < concurrent.Length; i++)
            {
                Assert.Equal(sequential[i % images.Length], concurrent[i]);
            }
        }
        finally
        {
            foreach (var image in images)
            {
                image.Dispose();
            }
        }
    }

    [Fact]
    public void Embed_refuses_buffers_of_the_wrong_length()
    {
        var tensorError = Assert.Throws<ArgumentException>(() => fixture.Embedder.Embed(new float[100], new float[512]));
        var embeddingError = Assert.Throws<ArgumentException>(() => fixture.Embedder.Embed(new float[fixture.Embedder.TensorLength], new float[511]));

        Assert.Contains("150528", tensorError.Message, StringComparison.Ordinal);
        Assert.Contains("512", embeddingError.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Fingerprint_is_hex_sha256_and_stable_across_loads()
    {
        Assert.Matches("^[0-9a-f]{64}$", fixture.Embedder.Fingerprint);
        Assert.Equal(fixture.Embedder.Fingerprint, ModelFingerprint.Compute(ModelCard.Default));
    }

    [Fact]
    public void Fingerprint_changes_with_preprocessing_but_not_with_the_card_name()
    {
        var card = ModelCard.Default;

        Assert.Equal(fixture.Embedder.Fingerprint, ModelFingerprint.Compute(card with { Name = "renamed" }));
        Assert.NotEqual(fixture.Embedder.Fingerprint, ModelFingerprint.Compute(card with { Scale = 0.5f }));
        Assert.NotEqual(fixture.Embedder.Fingerprint, ModelFingerprint.Compute(card with { ChannelOrder = ChannelOrder.Rgb }));
        Assert.NotEqual(fixture.Embedder.Fingerprint, ModelFingerprint.Compute(card with { MeanImageModel = null }));
    }

    [Fact]
    public void Embeddings_of_an_exif_rotated_photo_and_the_physically_rotated_photo_agree()
    {
        // skimage chelsea.png stored with EXIF orientation 6, against the same pixels rotated 90° clockwise and saved
        // without a tag. Both are JPEG at quality 95, so only compression noise may differ.
        using var original = Image.Load(ReferenceData.SkImage("chelsea.png"));
        using var tagged = new MemoryStream();
        original.Metadata.ExifProfile = new ExifProfile();
        original.Metadata.ExifProfile.SetValue(ExifTag.Orientation, (ushort)6);
        original.SaveAsJpeg(tagged, new JpegEncoder { Quality = 95 });
        using var rotated = new MemoryStream();
        original.Metadata.ExifProfile = null;
        original.Mutate(x => x.Rotate(RotateMode.Rotate90));
        original.SaveAsJpeg(rotated, new JpegEncoder { Quality = 95 });

        var fromTag = fixture.EmbedBytes(tagged.ToArray(), "chelsea-orientation-6.jpg");
        var fromPixels = fixture.EmbedBytes(rotated.ToArray(), "chelsea-rotated.jpg");
        var unrotated = fixture.EmbedFile(ReferenceData.SkImage("chelsea.png"));

        Assert.InRange(ExactSearch.CosineDistance(fromTag, fromPixels), 0, 0.01);
        Assert.True(ExactSearch.CosineDistance(fromTag, unrotated) > 0.01, "the check is only meaningful if rotation changes the embedding");
    }
}
