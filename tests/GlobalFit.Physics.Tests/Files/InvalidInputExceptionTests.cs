using GlobalFit.Physics.Files;

namespace GlobalFit.Physics.Tests.Files;

public class InvalidInputExceptionTests
{
    [Fact]
    public void The_message_names_source_location_and_problem()
    {
        var e = new InvalidInputException("run.toml", "line 3, key 'seed'", "must be a whole number");
        Assert.Equal("run.toml: line 3, key 'seed': must be a whole number", e.Message);
        Assert.Equal("must be a whole number", e.Problem);
    }

    [Fact]
    public void Line_breaks_and_control_codes_quoted_from_a_damaged_file_stay_off_the_terminal()
    {
        // A file signature quoted from the input, as an HDF5 library reports it: bytes that are line breaks, a tab,
        // an escape (start of a terminal control sequence) and a NUL.
        var e = new InvalidInputException("data.h5", null, "bad signature '\u0089HD\r\n\u001a\n\t\u001b[2J\0'");
        Assert.Equal("data.h5: bad signature '?HD  ?  ?[2J?'", e.Message);
        Assert.DoesNotContain(e.Message, char.IsControl);
    }
}
