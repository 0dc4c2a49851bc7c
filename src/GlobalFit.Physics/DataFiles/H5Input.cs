using GlobalFit.Physics.Files;
using PureHDF;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Typed, checked reads from an HDF5 file that came from a user: every problem becomes an
/// <see cref="InvalidInputException"/> naming the file and the group, dataset or attribute at fault.</summary>
/// <remarks>PureHDF reinterprets bytes when asked for the wrong type (an int64 attribute read as a double gives
/// 2.5e-323), so every read checks the stored type class and size first.</remarks>
internal sealed class H5Input(string source)
{
    /// <summary>The file, as named in error messages.</summary>
    public string Source { get; } = source;

    public InvalidInputException Error(string? location, string problem, Exception? inner = null) =>
        new(Source, location, problem, inner);

    /// <summary>Runs a PureHDF read, turning a library failure (corrupt or unexpected structure) into bad input at <paramref name="location"/>.</summary>
    public T Guard<T>(string location, Func<T> read)
    {
        try
        {
            return read();
        }
        catch (OutOfMemoryException e)
        {
            // The file as a whole was checked to fit in memory when it was opened, so an allocation the library cannot
            // make comes from a size field inside the file that no honest file of this length holds.
            throw Error(location, $"records a size that cannot be right for a file of this length (the file is damaged: {e.Message})", e);
        }
        catch (Exception e) when (e is not InvalidInputException)
        {
            throw Error(location, $"cannot be read ({e.Message})", e);
        }
    }

    public static string ChildPath(string groupPath, string name) => groupPath == "/" ? "/" + name : groupPath + "/" + name;

    public static string AttributePath(string objectPath, string name) => $"{objectPath} attribute {name}";

    // ---- links ----

    /// <summary>The child group <paramref name="name"/>, or null when there is no such link.</summary>
    public IH5Group? OptionalGroup(IH5Group parent, string parentPath, string name)
    {
        string path = ChildPath(parentPath, name);
        var child = OptionalChild(parent, path, name);
        return child switch
        {
            null => null,
            IH5Group group => group,
            _ => throw Error(path, "is not a group"),
        };
    }

    public IH5Group RequiredGroup(IH5Group parent, string parentPath, string name, string whenMissing) =>
        OptionalGroup(parent, parentPath, name) ?? throw Error(ChildPath(parentPath, name), whenMissing);

    /// <summary>The child dataset <paramref name="name"/>, or null when there is no such link.</summary>
    public IH5Dataset? OptionalDataset(IH5Group parent, string parentPath, string name)
    {
        string path = ChildPath(parentPath, name);
        var child = OptionalChild(parent, path, name);
        return child switch
        {
            null => null,
            IH5Dataset dataset => dataset,
            _ => throw Error(path, "is not a dataset"),
        };
    }

    public IH5Dataset RequiredDataset(IH5Group parent, string parentPath, string name) =>
        OptionalDataset(parent, parentPath, name) ?? throw Error(ChildPath(parentPath, name), "missing");

    private IH5Object? OptionalChild(IH5Group parent, string path, string name) =>
        Guard(path, () => parent.LinkExists(name) ? parent.Get(name) : null);

    // ---- datasets ----

    /// <summary>Checks that a dataset holds float64 values in <paramref name="rank"/> dimensions and returns its shape.</summary>
    public ulong[] Float64Shape(IH5Dataset dataset, string path, int rank)
    {
        var (typeClass, size, dims) = Guard(path, () => (dataset.Type.Class, dataset.Type.Size, dataset.Space.Dimensions));
        if (typeClass != H5DataTypeClass.FloatingPoint || size != 8)
            throw Error(path, $"holds {Describe(typeClass, size)} values; expected float64");
        if (dims.Length != rank)
            throw Error(path, $"has {dims.Length} dimensions; expected {rank}");
        return dims;
    }

    /// <summary>Checks that a dataset is a one-dimensional list of strings and returns its length.</summary>
    public ulong StringListLength(IH5Dataset dataset, string path)
    {
        var (typeClass, dims) = Guard(path, () => (dataset.Type.Class, dataset.Space.Dimensions));
        if (typeClass is not (H5DataTypeClass.String or H5DataTypeClass.VariableLength))
            throw Error(path, $"holds {Describe(typeClass, 0)} values; expected strings");
        if (dims.Length != 1)
            throw Error(path, $"has {dims.Length} dimensions; expected 1");
        return dims[0];
    }

    public double[] ReadDoubles(IH5Dataset dataset, string path) => Guard(path, () => dataset.Read<double[]>());

    public string[] ReadStrings(IH5Dataset dataset, string path) => Guard(path, () => dataset.Read<string[]>());

    /// <summary>Converts a dataset extent to a sample count, rejecting extents an array cannot hold.</summary>
    public int Count(ulong extent, string path) =>
        extent <= (ulong)Array.MaxLength ? (int)extent : throw Error(path, $"has {extent} entries, more than this program can hold in memory");

    // ---- attributes ----

    public bool HasAttribute(IH5Object owner, string ownerPath, string name) =>
        Guard(AttributePath(ownerPath, name), () => owner.AttributeExists(name));

    public string ReadString(IH5Object owner, string ownerPath, string name) =>
        ReadString(RequiredAttribute(owner, ownerPath, name), AttributePath(ownerPath, name));

    public string ReadString(IH5Attribute attribute, string path)
    {
        var typeClass = Guard(path, () => attribute.Type.Class);
        if (typeClass is not (H5DataTypeClass.String or H5DataTypeClass.VariableLength))
            throw Error(path, $"holds {Describe(typeClass, attribute.Type.Size)}; expected text");
        RequireSingleValue(attribute, path);
        return Guard(path, () => attribute.Read<string>()) ?? throw Error(path, "holds no text");
    }

    public string[] ReadStrings(IH5Object owner, string ownerPath, string name)
    {
        string path = AttributePath(ownerPath, name);
        var attribute = RequiredAttribute(owner, ownerPath, name);
        var typeClass = Guard(path, () => attribute.Type.Class);
        if (typeClass is not (H5DataTypeClass.String or H5DataTypeClass.VariableLength))
            throw Error(path, $"holds {Describe(typeClass, attribute.Type.Size)}; expected a list of names");
        return Guard(path, () => attribute.Read<string[]>());
    }

    /// <summary>Reads a single number stored as a float (32 or 64 bit) or an integer.</summary>
    public double ReadNumber(IH5Object owner, string ownerPath, string name)
    {
        string path = AttributePath(ownerPath, name);
        var attribute = RequiredAttribute(owner, ownerPath, name);
        var (typeClass, size) = Guard(path, () => (attribute.Type.Class, attribute.Type.Size));
        RequireSingleValue(attribute, path);
        return typeClass switch
        {
            H5DataTypeClass.FloatingPoint when size == 8 => Guard(path, () => attribute.Read<double>()),
            H5DataTypeClass.FloatingPoint when size == 4 => Guard(path, () => attribute.Read<float>()),
            H5DataTypeClass.FixedPoint => ReadInteger(attribute, path),
            _ => throw Error(path, $"holds {Describe(typeClass, size)}; expected a number"),
        };
    }

    /// <summary>Reads a single signed or unsigned integer of 1, 2, 4 or 8 bytes.</summary>
    public long ReadInteger(IH5Object owner, string ownerPath, string name)
    {
        string path = AttributePath(ownerPath, name);
        var attribute = RequiredAttribute(owner, ownerPath, name);
        var typeClass = Guard(path, () => attribute.Type.Class);
        if (typeClass != H5DataTypeClass.FixedPoint)
            throw Error(path, $"holds {Describe(typeClass, attribute.Type.Size)}; expected an integer");
        RequireSingleValue(attribute, path);
        return ReadInteger(attribute, path);
    }

    private long ReadInteger(IH5Attribute attribute, string path)
    {
        var (size, signed) = Guard(path, () => (attribute.Type.Size, attribute.Type.FixedPoint.IsSigned));
        return (size, signed) switch
        {
            (1, true) => Guard(path, () => attribute.Read<sbyte>()),
            (1, false) => Guard(path, () => attribute.Read<byte>()),
            (2, true) => Guard(path, () => attribute.Read<short>()),
            (2, false) => Guard(path, () => attribute.Read<ushort>()),
            (4, true) => Guard(path, () => attribute.Read<int>()),
            (4, false) => Guard(path, () => attribute.Read<uint>()),
            (8, true) => Guard(path, () => attribute.Read<long>()),
            (8, false) => Guard(path, () => attribute.Read<ulong>()) is var u && u <= long.MaxValue
                ? (long)u
                : throw Error(path, "holds an integer too large for this program"),
            _ => throw Error(path, $"holds a {size}-byte integer; expected 1, 2, 4 or 8 bytes"),
        };
    }

    private IH5Attribute RequiredAttribute(IH5Object owner, string ownerPath, string name)
    {
        string path = AttributePath(ownerPath, name);
        return HasAttribute(owner, ownerPath, name)
            ? Guard(path, () => owner.Attribute(name))
            : throw Error(path, "missing");
    }

    private void RequireSingleValue(IH5Attribute attribute, string path)
    {
        var dims = Guard(path, () => attribute.Space.Dimensions);
        ulong count = 1;
        foreach (ulong d in dims) count = checked(count * d);
        if (count != 1)
            throw Error(path, $"holds {count} values; expected one");
    }

    private static string Describe(H5DataTypeClass typeClass, int size) => typeClass switch
    {
        H5DataTypeClass.FloatingPoint => $"float{8 * size}",
        H5DataTypeClass.FixedPoint => $"{8 * size}-bit integer",
        H5DataTypeClass.String or H5DataTypeClass.VariableLength => "text",
        _ => typeClass.ToString(),
    };
}
