using Lookup.Imaging;

namespace Lookup.Embedding;

/// <summary>What <see cref="PhotoEmbedder"/> learned about one photo besides its embedding.</summary>
/// <param name="Info">Format, stored size, frames and orientation.</param>
/// <param name="DifferenceHash">64-bit dHash of the whole upright photo.</param>
/// <param name="Norm">L2 norm of the network output before normalisation.</param>
/// <param name="DecodeTime">Reading, checking and decoding the file, orientation and RGB conversion included.</param>
/// <param name="PrepareTime">dHash plus resize and crop to the input tensor.</param>
/// <param name="InferenceTime">The network run and normalisation.</param>
public sealed record PhotoEmbedding(
    PhotoInfo Info,
    ulong DifferenceHash,
    float Norm,
    TimeSpan DecodeTime,
    TimeSpan PrepareTime,
    TimeSpan InferenceTime);
