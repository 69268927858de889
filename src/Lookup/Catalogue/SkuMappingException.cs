namespace Lookup.Catalogue;

/// <summary>
/// A SKU mapping that cannot work at all: a bad option spec, a CSV file that cannot be read or has no usable
/// header. Problems with single rows or photos are not thrown; they are listed in <see cref="SkuMappingResult"/>.
/// </summary>
internal sealed class SkuMappingException(string message) : Exception(message);
