namespace Lookup.Sweeps;

/// <summary>Why a photo seems to be filed under the wrong SKU.</summary>
/// <param name="DistanceToOwnSku">Distance to the nearest other photo of its own SKU.</param>
/// <param name="OwnSkuSpread">The SKU's typical distance (median over its photos of the nearest-own distance); null for
/// a SKU of two photos, which has none.</param>
/// <param name="NearestOtherSku">The SKU of the nearest photo outside its own SKU.</param>
/// <param name="DistanceToOtherSku">Distance to that photo.</param>
/// <param name="FinishDifference">Set when the photo was flagged by its finish (<see cref="FinishSignature"/>): its
/// finish difference to the nearest in finish of the other photos of its SKU; that other SKU's photo has its finish.</param>
public sealed record OutlierEvidence(float DistanceToOwnSku, float? OwnSkuSpread, string NearestOtherSku, float DistanceToOtherSku, double? FinishDifference = null);
