namespace Lookup;

/// <summary>Names the engine assembly for tools that locate it by type.</summary>
public static class AssemblyMarker
{
}
