namespace Lookup.Tests;

public sealed class SmokeTests
{
    [Fact]
    public void The_engine_assembly_loads()
    {
        Assert.Equal("Lookup", typeof(AssemblyMarker).Assembly.GetName().Name);
    }
}
