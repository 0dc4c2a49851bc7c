using GlobalFit.Inference.Parameters;

namespace GlobalFit.Inference.Tests.Parameters;

public sealed class ParameterSchemaTests
{
    private static readonly ParameterSchema Schema = new(
    [
        new ParameterSpec("phase", "rad", 0.0, 2.0 * Math.PI, BoundaryKind.Periodic),
        new ParameterSpec("cos-inclination", string.Empty, -1.0, 1.0, BoundaryKind.Reflect),
        new ParameterSpec("frequency", "Hz", 1e-3, 2e-3, BoundaryKind.Reject),
    ]);

    [Theory]
    [InlineData(7.0, 7.0 - 2.0 * Math.PI)]
    [InlineData(-0.5, 2.0 * Math.PI - 0.5)]
    [InlineData(4.0 * Math.PI + 1.0, 1.0)]
    [InlineData(2.0 * Math.PI, 2.0 * Math.PI)]
    public void Periodic_parameters_wrap_into_the_range(double proposed, double expected)
    {
        double[] values = [proposed, 0.0, 1.5e-3];
        Assert.True(Schema.TryApplyBoundaries(values));
        Assert.Equal(expected, values[0], 12);
    }

    [Theory]
    [InlineData(1.2, 0.8)]
    [InlineData(-1.5, -0.5)]
    [InlineData(3.5, -0.5)]
    [InlineData(-1.0, -1.0)]
    public void Reflecting_parameters_mirror_at_the_edges(double proposed, double expected)
    {
        double[] values = [1.0, proposed, 1.5e-3];
        Assert.True(Schema.TryApplyBoundaries(values));
        Assert.Equal(expected, values[1], 12);
    }

    [Fact]
    public void Rejecting_parameters_refuse_out_of_range_values()
    {
        double[] values = [1.0, 0.0, 2.5e-3];
        Assert.False(Schema.TryApplyBoundaries(values));
        double[] notFinite = [double.NaN, 0.0, 1.5e-3];
        Assert.False(Schema.TryApplyBoundaries(notFinite));
    }

    [Fact]
    public void Periodic_parameters_need_a_finite_range()
    {
        var exception = Assert.Throws<ArgumentException>(() => new ParameterSchema(
            [new ParameterSpec("phase", "rad", 0.0, double.PositiveInfinity, BoundaryKind.Periodic)]));
        Assert.Equal("Boundary", exception.ParamName);
    }

    [Fact]
    public void Duplicate_names_are_refused()
    {
        Assert.Throws<ArgumentException>(() => new ParameterSchema(
            [new ParameterSpec("a", string.Empty, 0, 1, BoundaryKind.Reject), new ParameterSpec("a", string.Empty, 0, 1, BoundaryKind.Reject)]));
    }
}
